-- 011: arguments declared as an explicit list (`@argument days step=list`):
-- irregular arguments such as a mean motion by 1, 2, ... 9 days, then 10,
-- 20, ... 90, then 100, 200, ... days. They are taken as written: no step
-- is inferred from them and no row is expected between two of them.
-- listed = 1 only on an argument (position < 0) without a step.
ALTER TABLE layout_column ADD COLUMN listed INTEGER NOT NULL DEFAULT 0
  CHECK (listed = 0 OR (listed = 1 AND position < 0 AND step IS NULL AND start IS NULL));

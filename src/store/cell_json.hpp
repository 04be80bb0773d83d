#pragma once
/// Internal to the store: the JSON encoding of one table row's cells in the
/// column `cell_row.cells` (documented in schema/001_edition.sql, unpacked by
/// the view `cell`). Written without allocating once the buffer has grown:
/// the import encodes a million cells a second.

#include <string>
#include <string_view>

#include "edition/transcription.hpp"

namespace apograph::store {

/// Appends `"text"` to `out` with JSON escapes (quote, backslash, control
/// characters); other bytes are copied as they are.
void AppendJsonString(std::string& out, std::string_view text);

/// Appends one cell: `[raw,col]` when it is read in full, its raw text is its
/// value in canonical notation, it has `column_places` places, stands on
/// `row_line` and has no marks; otherwise `[raw,col,{...}]` with what differs.
void AppendCellJson(std::string& out, const Cell& cell, int column_places, int row_line);

/// Replaces `out` with the JSON array of a row of `t`: its argument, then its
/// cells in column order. The row's line is its argument's line.
void EncodeRowCells(std::string& out, const Transcription& t, const Row& row);

/// The reverse of EncodeRowCells (in cell_decode.cpp): fills `row` from the
/// JSON of one cell_row, with the places of the columns of `t` and the row's
/// line as defaults. Also reads what the view `cell` accepts (any JSON
/// spacing and escapes). Throws StoreError on anything else.
void DecodeRowCells(std::string_view json, const Transcription& t, int row_line, Row& row);

}  // namespace apograph::store

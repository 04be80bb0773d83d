#pragma once
/// Internal to the store: the JSON encoding of a revision's cells in the
/// column `revision_cells.rows` (documented in schema/014_revision_cells.sql
/// and 001_edition.sql, unpacked by the view `cell`). Written without
/// allocating once the buffer has grown: the import encodes a million cells
/// a second.

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

/// Appends one row of `t`: `[line,argument,cell,...]`, its line (its
/// argument's line), its argument, then its cells in column order.
void AppendRowJson(std::string& out, const Transcription& t, const Row& row);

/// Replaces `out` with the JSON array of every row of `t` in order: the text
/// of `revision_cells.rows`.
void EncodeRevisionRows(std::string& out, const Transcription& t);

/// Replaces `out` with the JSON array of the argument each row of `t`
/// stands for (Transcription::ArgumentInUse), in trade notation or null:
/// the text of `revision_cells.arguments`.
void EncodeRowArguments(std::string& out, const Transcription& t);

/// The reverse of EncodeRevisionRows (in cell_decode.cpp): appends the rows
/// of `json` to `t.rows`, with the places of the columns of `t` and each
/// row's line as defaults. Also reads what the view `cell` accepts (any
/// JSON spacing and escapes). Throws StoreError on anything else.
void DecodeRevisionRows(std::string_view json, Transcription& t);

}  // namespace apograph::store

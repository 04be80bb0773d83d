#pragma once
/// The edited table and its apparatus of variants: for every cell an
/// adopted reading (the lemma) with its witnesses, and the other readings
/// with theirs; written as TEI P5, LaTeX, CSV or text.
///
/// The lemma, unless the editor overrides it: among the readings that are
/// not errors (by recomputation, the caller's judgement or the majority, as
/// the collation decided), the one carried by most independent branches of
/// the stemma (each branch votes with the reading most of its witnesses
/// carry), then by most witnesses. Without a stemma every witness is its own
/// branch. When every reading is an error the lemma is still a transmitted
/// reading, chosen the same way, and the note says so: the tool does not
/// emend on its own; the editor does, with an override.

#include <string>
#include <vector>

#include "collate/collation.hpp"

namespace apograph::publish {

/// An editor's decision for one cell (see store/apparatus_store.hpp).
struct Override {
  std::string row;     ///< the row's argument as the editor writes it ("20", "0;30")
  std::string column;  ///< column name
  std::string reading;
  std::string note;
};

struct VariantReading {
  std::string text;
  std::vector<std::string> sigla;
  collate::ReadingKind kind = collate::ReadingKind::kValue;
  bool error = false;
};

struct ApparatusEntry {
  std::string lemma;                     ///< empty when no witness can be read
  std::vector<std::string> lemma_sigla;  ///< empty for an editor's emendation
  bool editor = false;                   ///< set by the editor's override
  bool emendation = false;               ///< the lemma is in no witness
  std::vector<VariantReading> variants;  ///< every other reading (om., illeg. included)
  std::string note;                      ///< the evidence or the editor's note
  bool HasVariants() const { return !variants.empty(); }
};

struct Apparatus {
  std::string table_id;
  std::string table_title;
  WorkInfo work;
  std::vector<WitnessInfo> witnesses;
  ArgumentSpec argument;
  std::vector<ColumnSpec> columns;
  std::vector<Sexagesimal> arguments;              ///< per row
  std::vector<std::vector<ApparatusEntry>> cells;  ///< [row][column]
};

/// Builds the apparatus. `branches` are the sigla of each independent
/// branch of the stemma (empty: each witness alone). Throws InputError
/// (option --override) for an override whose row or column is not in the
/// table.
Apparatus BuildApparatus(const collate::Collation& collation,
                         const std::vector<std::vector<std::string>>& branches,
                         const std::vector<Override>& overrides);

/// TEI P5: teiHeader with a listWit (library and shelfmark of every
/// witness), the table as table/row/cell, cells with variants as
/// app/lem/rdg with @wit pointing at the witnesses' xml:id.
std::string ToTei(const Apparatus& apparatus);
/// A LaTeX document (article class, longtable) with the table and numbered
/// apparatus notes under it.
std::string ToLatex(const Apparatus& apparatus);
/// One line per cell: argument, column, lemma, lemma_sigla, variants, note.
std::string ToCsv(const Apparatus& apparatus);
/// The edited table, then one apparatus line per cell with variants.
std::string ToText(const Apparatus& apparatus);

/// Makes a siglum usable as an xml:id (an XML name: letters, digits, '-',
/// '_', '.'; not starting with a digit).
std::string XmlId(const std::string& siglum);

}  // namespace apograph::publish

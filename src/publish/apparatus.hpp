#pragma once
/// The edited table and its apparatus of variants: for every cell an
/// adopted reading (the lemma) with its witnesses and the reason it was
/// preferred, the other readings with theirs and the cause of each error,
/// the editorial marks of the transcriptions (margin, interlinear,
/// corrections, damage, doubt, notes), the arguments a witness miswrote and
/// each witness's folios; written as TEI P5, LaTeX, CSV or text.
///
/// The lemma, in order of precedence:
///  1. the editor's override or conjecture for the cell;
///  2. a reading the editor accepted as an emendation of a witness;
///  3. among the readings that are not errors (by the editor's decisions,
///     recomputation, the caller's judgement or the majority, as the
///     collation decided), the one carried by most independent branches of
///     the stemma (each branch votes with the reading most of its witnesses
///     carry), then by most witnesses; without a stemma every witness is its
///     own branch;
///  4. when every reading that can be read is an error: the restoration the
///     explanations propose (or the recomputed value), marked as a
///     conjecture (LemmaSource::kRestored) for the editor to confirm;
///  5. when no witness can be read: the recomputed value, supplied.

#include <string>
#include <vector>

#include "collate/collation.hpp"
#include "pipeline/analysis.hpp"

namespace apograph::publish {

/// An editor's decision on one cell of the edited table.
struct Override {
  std::string row;     ///< the row's argument as the editor writes it ("20", "0;30")
  std::string column;  ///< column name
  std::string reading;
  std::string note;
  bool conjecture = false;  ///< proposed as a reading no witness has
  std::string editor;       ///< who decided (empty: not recorded)
};

/// Where a lemma comes from.
enum class LemmaSource {
  kWitnesses,   ///< a transcribed reading, chosen as above
  kEditor,      ///< a witness's reading the editor adopted (override)
  kEmendation,  ///< the editor's reading, in no witness (override or accepted emendation)
  kConjecture,  ///< the editor's conjecture, in no witness
  kRestored,    ///< every legible witness errs: restored by recomputation (a proposal)
  kSupplied,    ///< no witness can be read: supplied from recomputation
  kNone,        ///< no witness can be read and nothing can be supplied
};
/// "witnesses", "editor", "emendation", "conjecture", "restored", "supplied", "none".
const char* ToString(LemmaSource source);

/// An editorial mark on one witness's cell.
struct WitnessMark {
  std::string siglum;
  std::string kind;  ///< "margin", "interlinear", "correction", "damaged", "doubtful", "note"
  std::string text;  ///< in words: "in the margin", "corrected from 2;0,59", the note
};

struct VariantReading {
  std::string text;
  std::vector<std::string> sigla;
  collate::ReadingKind kind = collate::ReadingKind::kValue;
  bool error = false;
  std::string cause;   ///< slip class ("confusion", ...; TEI @cause); empty when none
  std::string why;     ///< short plain words ("digits transposed")
  std::string editor;  ///< the editor whose decision judged it
};

struct ApparatusEntry {
  std::string lemma;                     ///< empty for LemmaSource::kNone
  std::vector<std::string> lemma_sigla;  ///< the witnesses that read the lemma
  collate::ReadingKind lemma_kind = collate::ReadingKind::kValue;
  bool lemma_error = false;  ///< a transcribed lemma every witness has wrong (nothing better)
  LemmaSource source = LemmaSource::kWitnesses;
  std::string resp;    ///< the editor responsible for the lemma (a decision), or empty
  std::string reason;  ///< why the lemma, in plain words (shown when there is a note)
  std::vector<VariantReading> variants;  ///< every other reading (om., illeg. included)
  std::vector<WitnessMark> marks;        ///< marks on the witnesses' cells
  bool HasVariants() const { return !variants.empty(); }
  /// The cell earns an apparatus note: variants, marks, or an editorial lemma.
  bool NeedsNote() const {
    return HasVariants() || !marks.empty() || source != LemmaSource::kWitnesses;
  }
  bool Editorial() const;  ///< the editor decided the lemma
};

/// A miswritten argument: what some witnesses wrote for a row's argument.
struct ArgumentVariant {
  std::string text;
  std::vector<std::string> sigla;
};

struct Apparatus {
  std::string table_id;
  std::string table_title;
  WorkInfo work;
  std::vector<WitnessInfo> witnesses;
  std::vector<std::string> folios;   ///< per witness: the table's folios in it ("12r-14v")
  std::vector<std::string> editors;  ///< who decided (TEI header, LaTeX title block)
  std::string reference;             ///< what the readings were recomputed from
  ArgumentSpec argument;
  std::vector<ColumnSpec> columns;
  std::vector<Sexagesimal> arguments;                      ///< per row
  std::vector<std::vector<ArgumentVariant>> arg_variants;  ///< per row
  std::vector<std::vector<ApparatusEntry>> cells;          ///< [row][column]
  /// The title, or the table id when none was imported.
  std::string Title() const { return table_title.empty() ? table_id : table_title; }
};

struct ApparatusOptions {
  /// The sigla of each independent branch of the stemma (empty: each
  /// witness alone).
  std::vector<std::vector<std::string>> branches;
  std::vector<Override> overrides;
  /// The collated transcriptions, for marks, written arguments and folios
  /// (nullptr: none shown).
  const std::vector<Transcription>* transcriptions = nullptr;
  std::vector<std::string> editors;
};

/// Builds the apparatus. Throws InputError (option --override) for an
/// override whose row or column is not in the table.
Apparatus BuildApparatus(const collate::Collation& collation, const ApparatusOptions& options = {});

/// The apparatus of an analysed table: branches of its parsimony stemma,
/// the editor's decisions, marks and folios of its transcriptions. `editor`
/// (may be empty) is named in the header beside those who decided.
Apparatus BuildApparatus(const pipeline::TableAnalysis& analysis, const std::string& editor = "");

/// The overrides and conjectures in force, as the apparatus takes them.
std::vector<Override> OverridesFrom(const pipeline::TableDecisions& decisions);

/// TEI P5: teiHeader (title, editors, listWit with library, shelfmark,
/// date and folios), the table as table/row/cell; a cell with a note as
/// app/lem/rdg (@wit, @cause for the slip class, @resp for the editor's
/// decisions, lem @type "conjecture" or "emendation", supplied for a cell no
/// witness can be read), witDetail for the marks, note for the reasons.
std::string ToTei(const Apparatus& apparatus);

struct LatexOptions {
  /// A fragment to \input into a book (no preamble, no \begin{document});
  /// the book loads longtable (and fontenc T1 with lmodern for vector fonts).
  bool fragment = false;
};
/// LaTeX: vector fonts (T1, Latin Modern), the table in a longtable with
/// one column per sexagesimal place so that numbers align by place, the
/// apparatus keyed by argument under it.
std::string ToLatex(const Apparatus& apparatus, const LatexOptions& options = {});
/// Long form, one row per reading (RFC 4180): first one row per witness
/// (its folios), then per cell the lemma and each variant, per row each
/// miswritten argument. Columns: arg, column, role, reading, witnesses,
/// kind, error, cause, why, marks, source, editor.
std::string ToCsv(const Apparatus& apparatus);
/// The edited table, then the apparatus keyed by argument.
std::string ToText(const Apparatus& apparatus);

/// Makes a siglum usable as an xml:id (an XML name: letters, digits, '-',
/// '_', '.'; not starting with a digit).
std::string XmlId(const std::string& siglum);

}  // namespace apograph::publish

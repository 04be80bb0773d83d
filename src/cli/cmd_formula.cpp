// apograph formula: save, show and list user formulas (and the built-in
// models they stand beside).
#include "cli/command.hpp"

#include <filesystem>
#include <ostream>
#include <sstream>

#include <nlohmann/json.hpp>

#include "model/formula.hpp"
#include "store/model_store.hpp"
#include "support/input_error.hpp"
#include "support/tabular.hpp"

namespace apograph::cli {

extern const char kFormulaUsage[] =
    "usage: apograph formula save NAME 'TEXT' [--description TEXT] [--db FILE]\n"
    "       apograph formula list [--builtin] [--format text|csv|json] [--db FILE]\n"
    "       apograph formula show NAME [--format text|json] [--db FILE]\n\n"
    "A formula is a model of one column written in apograph's formula language\n"
    "(grammar/formula.ebnf): parameters with defaults, arg, other columns of the row\n"
    "(col(NAME)), neighbouring rows (col(NAME, +1), arg(-1), self(1)), arithmetic and\n"
    "sin cos tan asin acos atan atan2 sqrt abs floor mod min max crd round trunc (degrees).\n"
    "A saved formula is used like a built-in model: apograph check --model NAME.\n\n"
    "example: apograph formula save sixtieths '(col(chord, +1) - col(chord)) / 30'";

namespace {

std::string ParamText(const model::ParamSpec& p) {
  std::ostringstream s;
  s << p.name << " = " << p.default_value << " (" << p.low << " .. " << p.high << ")";
  if (!p.unit.empty()) s << " " << p.unit;
  if (!p.description.empty()) s << ": " << p.description;
  return s.str();
}

nlohmann::json ModelJson(const model::Model& m, const std::string& kind, const std::string& text) {
  nlohmann::json params = nlohmann::json::array();
  for (const auto& p : m.params()) {
    params.push_back({{"name", p.name},
                      {"unit", p.unit},
                      {"description", p.description},
                      {"default", p.default_value},
                      {"low", p.low},
                      {"high", p.high}});
  }
  return {{"name", m.name()},
          {"kind", kind},
          {"description", kind == "builtin" ? m.description() : text},
          {"convention", m.convention()},
          {"parameters", params}};  // definitions; `params` holds values elsewhere
}

void CheckName(const std::string& name) {
  bool ok = !name.empty();
  for (char c : name)
    ok = ok && (std::isalnum(static_cast<unsigned char>(c)) || c == '-' || c == '_' || c == '.');
  if (!ok)
    throw InputError::ForOption(
        "formula save",
        ExpectedFound("a name of letters, digits, '-', '_' or '.'", "'" + name + "'"));
  if (model::FindBuiltinModel(name)) {
    throw InputError::ForOption(
        "formula save", ExpectedFound("a name that is not a built-in model", "'" + name + "'"));
  }
}

int Save(store::Database& db, const std::vector<std::string>& pos, const std::string& description,
         Io& io) {
  if (pos.size() != 3)
    throw InputError::ForOption(
        "formula save",
        ExpectedFound("NAME and 'TEXT'", std::to_string(pos.size() - 1) + " arguments"));
  CheckName(pos[1]);
  auto f = model::CompileFormula(pos[2], pos[1]);  // only valid formulas are saved
  store::SaveFormula(db, {pos[1], pos[2], description, ""});
  io.out << "saved formula " << pos[1] << " (" << f->params().size() << " parameters)\n";
  return kOk;
}

int List(store::Database* db, bool builtin, Format format, Io& io) {
  Tabular t;
  t.headers = {"name", "kind", "parameters", "description"};
  nlohmann::json out = nlohmann::json::array();
  auto add = [&](const model::Model& m, const std::string& kind, const std::string& text) {
    std::string ps;
    for (const auto& p : m.params()) ps += (ps.empty() ? "" : ", ") + p.name;
    t.Add({m.name(), kind, ps, kind == "builtin" ? m.description() : text});
    out.push_back(ModelJson(m, kind, text));
  };
  if (builtin) {
    for (const model::Model* m : model::BuiltinModels()) add(*m, "builtin", "");
  }
  if (db) {
    for (const auto& f : store::ListFormulas(*db)) {
      try {
        add(*model::CompileFormula(f.text, f.name, "formula " + f.name), "formula",
            f.description.empty() ? f.text : f.description);
      } catch (const InputError& e) {  // saved by an older version: listed with the reason
        const std::string why = "does not compile: " + e.diagnostics().front().message;
        t.Add({f.name, "formula", "-", why});
        out.push_back({{"name", f.name}, {"kind", "formula"}, {"error", why}});
      }
    }
  }
  if (format == Format::kJson)
    io.out << nlohmann::json{{"models", out}}.dump(2) << "\n";
  else if (format == Format::kCsv)
    io.out << t.RenderCsv();
  else
    io.out << t.RenderText();
  return kOk;
}

int Show(store::Database* db, const std::vector<std::string>& pos, Format format, Io& io) {
  if (pos.size() != 2)
    throw InputError::ForOption(
        "formula show", ExpectedFound("NAME", std::to_string(pos.size() - 1) + " arguments"));
  std::unique_ptr<model::FormulaModel> holder;
  const model::Model* m = model::FindBuiltinModel(pos[1]);
  std::string kind = "builtin", text, description;
  if (!m && db) {
    if (auto f = store::FindFormula(*db, pos[1])) {
      holder = model::CompileFormula(f->text, f->name, "formula " + f->name);
      m = holder.get();
      kind = "formula";
      text = f->text;
      description = f->description;
    }
  }
  if (!m)
    throw InputError::ForOption(
        "formula show", ExpectedFound("a built-in model or a saved formula", "'" + pos[1] + "'"));
  if (format == Format::kJson) {
    auto j = ModelJson(*m, kind, text);
    j["text"] = kind == "formula" ? nlohmann::json(text) : nlohmann::json(nullptr);
    if (kind == "formula") j["description"] = description;
    io.out << j.dump(2) << "\n";
    return kOk;
  }
  io.out << m->name() << " (" << (kind == "builtin" ? "built-in model" : "saved formula") << ")\n";
  if (!description.empty()) io.out << description << "\n";
  io.out << (kind == "builtin" ? m->description() : text) << "\n";
  if (!m->convention().empty()) io.out << m->convention() << "\n";
  for (const auto& p : m->params()) io.out << "  param " << ParamText(p) << "\n";
  return kOk;
}

}  // namespace

int RunFormula(const std::vector<std::string>& args, Io& io) {
  std::vector<std::string> pos;
  std::string description, db_path, format;
  bool builtin = false;
  po::options_description d("options");
  d.add_options()("description", po::value(&description), "save: what the formula computes")(
      "builtin", po::bool_switch(&builtin), "list: include the built-in models")(
      "words", po::value(&pos), "ACTION [NAME [TEXT]]");
  AddFormatOption(d, format, {"text", "csv", "json"});
  AddDbOption(d, db_path);
  po::positional_options_description positional;
  positional.add("words", -1);
  po::variables_map vm;
  if (ParseOptions(FindCommand("formula"), args, d, vm, io, &positional)) return kOk;
  if (pos.empty())
    throw InputError::ForOption("apograph formula", ExpectedFound("save, list or show", "nothing"));
  const bool have_db = std::filesystem::exists(db_path);
  std::unique_ptr<store::Database> db;
  if (pos[0] == "save" || have_db) db = std::make_unique<store::Database>(db_path);
  if (pos[0] == "save") return Save(*db, pos, description, io);
  if (pos[0] == "list") return List(db.get(), builtin, ParseFormat(format), io);
  if (pos[0] == "show") return Show(db.get(), pos, ParseFormat(format), io);
  throw InputError::ForOption("apograph formula",
                              ExpectedFound("save, list or show", "'" + pos[0] + "'"));
}

}  // namespace apograph::cli

#include "tradition_json.hpp"

#include "key_json.hpp"

namespace apograph::synth {
namespace {

using nlohmann::json;

const std::string& Name(const Tradition& t, int i) {
  return t.nodes[static_cast<std::size_t>(i)].name;
}

json Date(const CatalogueDate& d) {
  return {{"year", d.year}, {"text", d.text}, {"from", d.from}, {"to", d.to}};
}

json ContaminationJson(const Tradition& t, const Node& n) {
  if (!n.contamination) return nullptr;
  const Contamination& c = *n.contamination;
  const AuthorTable& table = t.tables[static_cast<std::size_t>(c.table)];
  return {{"exemplars", {Name(t, n.parent), Name(t, c.second)}},
          {"between_tables", c.between_tables},
          {"table", table.key.id},
          {"row", c.row},
          {"arg", table.key.argument.values[static_cast<std::size_t>(c.row)].ToString()}};
}

json Corrections(const Node& n) {
  json out = json::array();
  for (const auto& c : n.corrections) {
    out.push_back({{"table", c.table},
                   {"origin_row", c.origin_row},
                   {"arg", c.arg},
                   {"column", c.column},
                   {"before", c.before},
                   {"after", c.after},
                   {"restores_archetype", c.restores_archetype}});
  }
  return out;
}

json Slips(const std::vector<Slip>& slips) {
  json out = json::array();
  for (const auto& s : slips) out.push_back(ToJson(s));
  return out;
}

json Visible(const Tradition& t, const Node& n) {
  json out = json::array();
  if (!n.surviving) return out;
  for (const auto& v : VisibleSlips(t, t.Find(n.name))) {
    json s = ToJson(v.slip);
    s["by"] = v.by;
    out.push_back(s);
  }
  return out;
}

json NodeJson(const Tradition& t, const Node& n) {
  return {{"name", n.name},
          {"surviving", n.surviving},
          {"parent", n.parent < 0 ? json(nullptr) : json(Name(t, n.parent))},
          {"kind", WitnessKindName(n.kind)},
          {"hand", {{"kind", HandKindName(n.hand.kind)}, {"script", ScriptName(n.hand.script)}}},
          {"script_attribute", ApographScriptName(n.hand.script)},
          {"digitised", n.digitised},
          {"date", Date(n.date)},
          {"library", n.library},
          {"shelfmark", n.shelfmark},
          {"rate", n.rate},
          {"corrector",
           {{"mode", CorrectorModeName(n.corrector)},
            {"share", n.correction_share},
            {"derived_basis", n.derived_basis}}},
          {"contamination", ContaminationJson(t, n)},
          {"slips", Slips(n.slips)},
          {"recognition", Slips(n.recognition)},
          {"corrections", Corrections(n)},
          {"errors", Visible(t, n)}};
}

json Summary(const Tradition& t) {
  json copies = json::array(), contaminated = json::array(), correctors = json::array();
  for (int i : t.Surviving()) {
    const Node& n = t.nodes[static_cast<std::size_t>(i)];
    const Node& p = t.nodes[static_cast<std::size_t>(n.parent)];
    if (p.surviving) copies.push_back({{"copy", n.name}, {"exemplar", p.name}});
    if (n.contamination) {
      json c = ContaminationJson(t, n);
      c["witness"] = n.name;
      contaminated.push_back(c);
    }
    if (n.corrector != CorrectorMode::kNone) {
      correctors.push_back({{"witness", n.name},
                            {"mode", CorrectorModeName(n.corrector)},
                            {"share", n.correction_share},
                            {"corrections", n.corrections.size()}});
    }
  }
  return {{"copies", copies}, {"contaminated", contaminated}, {"correctors", correctors}};
}

json GroupsJson(const Tradition& t) {
  json out = json::array();
  for (const auto& g : Groups(t)) {
    out.push_back({{"node", g.node},
                   {"witnesses", g.witnesses},
                   {"errors_exact", g.errors_exact},
                   {"errors_some", g.errors_some}});
  }
  return out;
}

json Departures(const Tradition& t) {
  json out = json::array();
  for (const auto& table : t.tables) {
    for (const auto& c : table.key.columns) {
      for (const auto& d : c.departures) {
        out.push_back(
            {{"table", table.key.id},
             {"column", c.name},
             {"row", d.row},
             {"arg", table.key.argument.values[static_cast<std::size_t>(d.row)].ToString()},
             {"units", d.units}});
      }
    }
  }
  return out;
}

}  // namespace

json ToJson(const Slip& s) {
  return {{"slip", SlipName(s.slip)},
          {"table", s.table},
          {"origin_row", s.origin_row},
          {"arg", s.arg},
          {"column", s.column},
          {"copy_row", s.copy_row},
          {"before", s.before},
          {"after", s.after},
          {"run", s.run},
          {"place", s.place},
          {"pair", s.pair},
          {"listed", s.listed},
          {"detail", s.detail}};
}

json TraditionJson(const Tradition& t) {
  json tables = json::array(), nodes = json::array(), witnesses = json::array();
  for (const auto& table : t.tables) tables.push_back(ToJson(table.key));
  for (const auto& n : t.nodes) nodes.push_back(NodeJson(t, n));
  for (int i : t.Surviving()) witnesses.push_back(Name(t, i));
  json out = {{"work", {{"id", t.work.id}, {"title", t.work.title}, {"author", t.work.author}}},
              {"tables", tables},
              {"witnesses", witnesses},
              {"newick", Newick(t, false)},
              {"newick_leaves", Newick(t, true)},
              {"groups", GroupsJson(t)},
              {"author_departures", Departures(t)},
              {"nodes", nodes}};
  out.update(Summary(t));
  return out;
}

}  // namespace apograph::synth

#pragma once
// A JSON Schema (draft 2020-12) validator for the subset the schemas in
// schema/json/ use: type (one or several), properties, required,
// additionalProperties (false or a schema), items, enum, const, minimum,
// anyOf, $ref (within a file, "#/$defs/NAME", or to a sibling file,
// "common.json#/$defs/NAME"), and the annotations $schema, $id, $defs,
// title, description, deprecated. A schema that uses any other keyword is
// refused (SchemaProblems), so the subset cannot be left silently.
// Why our own and not a library: see DEVELOPERS.md ("JSON output").
#include <map>
#include <set>
#include <string>
#include <vector>

#include <nlohmann/json.hpp>

#include "cli_runner.hpp"
#include "test_paths.hpp"

namespace apograph::testing {

class JsonSchemas {
 public:
  /// Loads every schema/json/*.json of the source tree.
  JsonSchemas() {
    namespace fs = std::filesystem;
    for (const auto& e :
         fs::directory_iterator(fs::path(APOGRAPH_SOURCE_DIR) / "schema" / "json")) {
      if (e.path().extension() == ".json")
        files_[e.path().filename().string()] = nlohmann::json::parse(ReadWholeFile(e.path()));
    }
  }

  const std::map<std::string, nlohmann::json>& files() const { return files_; }

  /// What is wrong with `instance` against schema file `name`; empty when it conforms.
  std::vector<std::string> Validate(const std::string& name, const nlohmann::json& instance) const {
    std::vector<std::string> out;
    auto it = files_.find(name);
    if (it == files_.end()) return {"no schema " + name};
    Check(name, it->second, instance, "$", out);
    return out;
  }

  /// Keywords outside the subset, a missing $schema, dangling $refs.
  std::vector<std::string> SchemaProblems() const {
    std::vector<std::string> out;
    for (const auto& [name, doc] : files_) {
      if (doc.value("$schema", "") != "https://json-schema.org/draft/2020-12/schema")
        out.push_back(name + ": $schema is not draft 2020-12");
      Walk(name, doc, name, out);
    }
    return out;
  }

 private:
  using json = nlohmann::json;

  static bool Keyword(const std::string& k) {
    static const std::set<std::string> kAll = {
        "$schema",    "$id",         "$defs",      "$ref",
        "title",      "description", "deprecated", "type",
        "properties", "required",    "items",      "enum",
        "const",      "minimum",     "anyOf",      "additionalProperties"};
    return kAll.count(k) > 0;
  }

  void Walk(const std::string& file, const json& s, const std::string& where,
            std::vector<std::string>& out) const {
    if (!s.is_object()) return;
    for (const auto& [k, v] : s.items()) {
      if (!Keyword(k)) out.push_back(where + ": unsupported keyword '" + k + "'");
      if (k == "$ref" && !Resolve(file, v.get<std::string>()).second)
        out.push_back(where + ": dangling $ref " + v.get<std::string>());
      if (k == "properties" || k == "$defs") {
        for (const auto& [name, sub] : v.items()) Walk(file, sub, where + "/" + name, out);
      } else if (k == "anyOf") {
        for (const auto& sub : v) Walk(file, sub, where + "/anyOf", out);
      } else if (k == "items" || (k == "additionalProperties" && v.is_object())) {
        Walk(file, v, where + "/" + k, out);
      }
    }
  }

  /// The file a reference leads to and the schema there (nullptr when none).
  std::pair<std::string, const json*> Resolve(const std::string& file,
                                              const std::string& ref) const {
    const auto hash = ref.find('#');
    const std::string target = hash == 0 ? file : ref.substr(0, hash);
    auto it = files_.find(target);
    if (it == files_.end() || hash == std::string::npos) return {target, nullptr};
    const json::json_pointer pointer(ref.substr(hash + 1));
    if (!it->second.contains(pointer)) return {target, nullptr};
    return {target, &it->second.at(pointer)};
  }

  static bool HasType(const json& v, const std::string& t) {
    if (t == "null") return v.is_null();
    if (t == "boolean") return v.is_boolean();
    if (t == "string") return v.is_string();
    if (t == "integer") return v.is_number_integer();
    if (t == "number") return v.is_number();
    if (t == "object") return v.is_object();
    if (t == "array") return v.is_array();
    return false;
  }

  void CheckType(const json& type, const json& v, const std::string& path,
                 std::vector<std::string>& out) const {
    const auto types = type.is_array() ? type : json::array({type});
    for (const auto& t : types) {
      if (HasType(v, t.get<std::string>())) return;
    }
    out.push_back(path + ": expected " + type.dump() + ", found " + v.dump().substr(0, 60));
  }

  void CheckObject(const std::string& file, const json& s, const json& v, const std::string& path,
                   std::vector<std::string>& out) const {
    if (!v.is_object()) return;
    for (const auto& r : s.value("required", json::array())) {
      if (!v.contains(r.get<std::string>()))
        out.push_back(path + ": missing field '" + r.get<std::string>() + "'");
    }
    const json props = s.value("properties", json::object());
    for (const auto& [k, sub] : v.items()) {
      if (props.contains(k)) {
        Check(file, props[k], sub, path + "." + k, out);
      } else if (s.contains("additionalProperties")) {
        const json& extra = s["additionalProperties"];
        if (extra.is_boolean() && !extra.get<bool>())
          out.push_back(path + ": field '" + k + "' is not in the schema");
        else if (extra.is_object())
          Check(file, extra, sub, path + "." + k, out);
      }
    }
  }

  void Check(const std::string& file, const json& s, const json& v, const std::string& path,
             std::vector<std::string>& out) const {
    if (s.contains("$ref")) {
      const auto [target, sub] = Resolve(file, s["$ref"].get<std::string>());
      if (!sub)
        out.push_back(path + ": dangling $ref");
      else
        Check(target, *sub, v, path, out);
    }
    if (s.contains("type")) CheckType(s["type"], v, path, out);
    if (s.contains("enum") && std::find(s["enum"].begin(), s["enum"].end(), v) == s["enum"].end())
      out.push_back(path + ": " + v.dump() + " is not one of " + s["enum"].dump());
    if (s.contains("const") && s["const"] != v)
      out.push_back(path + ": expected " + s["const"].dump());
    if (s.contains("minimum") && v.is_number() && v.get<double>() < s["minimum"].get<double>())
      out.push_back(path + ": below the minimum " + s["minimum"].dump());
    if (s.contains("anyOf")) {
      bool any = false;
      for (const auto& alt : s["anyOf"]) {
        std::vector<std::string> sub;
        Check(file, alt, v, path, sub);
        any = any || sub.empty();
      }
      if (!any) out.push_back(path + ": matches none of anyOf");
    }
    CheckObject(file, s, v, path, out);
    if (s.contains("items") && v.is_array()) {
      for (std::size_t i = 0; i < v.size(); ++i)
        Check(file, s["items"], v[i], path + "[" + std::to_string(i) + "]", out);
    }
  }

  std::map<std::string, json> files_;
};

}  // namespace apograph::testing

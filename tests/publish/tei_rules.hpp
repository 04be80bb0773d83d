#pragma once
// The TEI P5 content rules a test can check without the TEI schema: the
// parts of the content models the apparatus uses (TEI, teiHeader, fileDesc,
// titleStmt, respStmt, listWit, table/row/cell, app/lem/rdg/witDetail/note,
// supplied), that every @wit and @resp points at a declared witness or
// editor, and the project's own rules (no empty lem, lem/@type from a
// closed list, @cause only on readings). The document is parsed with
// tinyxml2 first.
#include <tinyxml2.h>

#include <set>
#include <sstream>
#include <string>
#include <vector>

namespace apograph::testing {

class TeiChecker {
 public:
  /// Every problem found, in words; empty when the document passes.
  std::vector<std::string> Check(const std::string& xml) {
    problems_.clear();
    tinyxml2::XMLDocument doc;
    if (doc.Parse(xml.c_str()) != tinyxml2::XML_SUCCESS) {
      problems_.push_back(std::string("not well-formed XML: ") + doc.ErrorStr());
      return problems_;
    }
    const auto* root = doc.RootElement();
    if (Name(root) != "TEI") Fail("the root is not TEI");
    const char* ns = root->Attribute("xmlns");
    if (!ns || std::string(ns) != "http://www.tei-c.org/ns/1.0")
      Fail("TEI lacks the TEI namespace");
    ExpectChildren(root, {"teiHeader", "text"});
    CollectIds(root);
    Header(root->FirstChildElement("teiHeader"));
    Walk(root->FirstChildElement("text"), false);
    return problems_;
  }

 private:
  static std::string Name(const tinyxml2::XMLElement* e) { return e ? e->Name() : ""; }

  void Fail(const std::string& what) { problems_.push_back(what); }

  std::vector<std::string> Children(const tinyxml2::XMLElement* e) {
    std::vector<std::string> out;
    for (auto* c = e ? e->FirstChildElement() : nullptr; c; c = c->NextSiblingElement())
      out.push_back(c->Name());
    return out;
  }

  void ExpectChildren(const tinyxml2::XMLElement* e, const std::vector<std::string>& names) {
    if (Children(e) != names) Fail("<" + Name(e) + "> must hold exactly " + Join(names));
  }

  static std::string Join(const std::vector<std::string>& v) {
    std::string out;
    for (const auto& s : v) out += (out.empty() ? "" : ", ") + s;
    return out;
  }

  void CollectIds(const tinyxml2::XMLElement* e) {
    for (auto* c = e->FirstChildElement(); c; c = c->NextSiblingElement()) {
      if (const char* id = c->Attribute("xml:id")) {
        if (!ids_.insert(id).second) Fail(std::string("xml:id '") + id + "' is not unique");
        if (Name(c) == "witness") witnesses_.insert(id);
        if (Name(c) == "editor" || Name(c) == "persName" || Name(c) == "name") editors_.insert(id);
      }
      CollectIds(c);
    }
  }

  void Header(const tinyxml2::XMLElement* h) {
    const auto kids = Children(h);
    if (kids.empty() || kids[0] != "fileDesc") Fail("teiHeader must begin with fileDesc");
    const auto* fd = h ? h->FirstChildElement("fileDesc") : nullptr;
    const auto fk = Children(fd);
    if (fk.size() < 3 || fk[0] != "titleStmt" || fk[1] != "publicationStmt" ||
        fk.back() != "sourceDesc")
      Fail("fileDesc must be titleStmt, publicationStmt, ..., sourceDesc");
    TitleStmt(fd ? fd->FirstChildElement("titleStmt") : nullptr);
    for (const auto* w = FindFirst(h, "listWit"); w; w = nullptr) {
      for (const auto& k : Children(w)) {
        if (k != "witness" && k != "head") Fail("listWit holds <" + k + ">");
      }
    }
  }

  void TitleStmt(const tinyxml2::XMLElement* t) {
    const auto kids = Children(t);
    if (kids.empty() || kids[0] != "title") Fail("titleStmt must begin with title");
    bool after_title = false, editor = false;
    for (const auto& k : kids) {
      if (k != "title") after_title = true;
      if (k == "title" && after_title) Fail("titleStmt: title after the responsibility statements");
      if (k != "title" && k != "author" && k != "editor" && k != "respStmt" && k != "funder" &&
          k != "sponsor" && k != "principal" && k != "meeting")
        Fail("titleStmt holds <" + k + ">");
      editor = editor || k == "editor";
    }
    if (!editor) Fail("titleStmt names no editor");
    for (auto* r = t ? t->FirstChildElement("respStmt") : nullptr; r;
         r = r->NextSiblingElement("respStmt")) {
      const auto rk = Children(r);
      const bool resp = std::count(rk.begin(), rk.end(), "resp") >= 1;
      const bool who = std::count(rk.begin(), rk.end(), "name") +
                           std::count(rk.begin(), rk.end(), "persName") +
                           std::count(rk.begin(), rk.end(), "orgName") >=
                       1;
      if (!resp || !who) Fail("respStmt needs resp and a name");
    }
  }

  static const tinyxml2::XMLElement* FindFirst(const tinyxml2::XMLElement* e, const char* name) {
    for (auto* c = e ? e->FirstChildElement() : nullptr; c; c = c->NextSiblingElement()) {
      if (Name(c) == name) return c;
      if (auto* f = FindFirst(c, name)) return f;
    }
    return nullptr;
  }

  void Pointers(const tinyxml2::XMLElement* e, const char* attr, const std::set<std::string>& ok) {
    const char* v = e->Attribute(attr);
    if (!v) return;
    std::istringstream in(v);
    for (std::string t; in >> t;) {
      if (t.size() < 2 || t[0] != '#' || !ok.count(t.substr(1)))
        Fail("<" + Name(e) + " " + attr + "> points at '" + t + "', which is not declared");
    }
  }

  static bool Empty(const tinyxml2::XMLElement* e) {
    return !e->FirstChildElement() && (!e->GetText() || std::string(e->GetText()).empty());
  }

  void App(const tinyxml2::XMLElement* app) {
    const auto kids = Children(app);
    int lems = 0, readings = 0;
    for (std::size_t i = 0; i < kids.size(); ++i) {
      const auto& k = kids[i];
      if (k == "lem" && i != 0) Fail("app: lem is not first");
      lems += k == "lem";
      readings += k == "lem" || k == "rdg";
      if (k != "lem" && k != "rdg" && k != "witDetail" && k != "note" && k != "rdgGrp" &&
          k != "wit")
        Fail("app holds <" + k + ">");
    }
    if (lems > 1) Fail("app holds more than one lem");
    if (readings == 0) Fail("app holds neither lem nor rdg");
    for (auto* c = app->FirstChildElement(); c; c = c->NextSiblingElement()) {
      if (Name(c) == "lem" && Empty(c)) Fail("an empty <lem/>");
      if (Name(c) == "lem" && c->Attribute("type")) {
        const std::string t = c->Attribute("type");
        if (t != "conjecture" && t != "emendation") Fail("lem type '" + t + "'");
      }
      if (Name(c) == "witDetail" && !c->Attribute("wit")) Fail("witDetail without wit");
    }
  }

  void Walk(const tinyxml2::XMLElement* e, bool in_cell) {
    if (!e) return;
    Pointers(e, "wit", witnesses_);
    Pointers(e, "resp", editors_);
    const std::string n = Name(e);
    if (e->Attribute("cause") && n != "rdg" && n != "lem") Fail("@cause on <" + n + ">");
    if (n == "app") App(e);
    if (n == "supplied" && !e->Attribute("reason")) Fail("supplied without reason");
    if (n == "cell" && in_cell) Fail("a cell inside a cell");
    if (n == "table") Table(e);
    if ((n == "lem" || n == "rdg") && Name(e->Parent()->ToElement()) != "app" &&
        Name(e->Parent()->ToElement()) != "rdgGrp")
      Fail("<" + n + "> outside an app");
    for (auto* c = e->FirstChildElement(); c; c = c->NextSiblingElement())
      Walk(c, in_cell || n == "cell");
  }

  void Table(const tinyxml2::XMLElement* t) {
    int rows = 0, cols = 0;
    bool head_done = false;
    for (auto* c = t->FirstChildElement(); c; c = c->NextSiblingElement()) {
      if (Name(c) == "head") {
        if (head_done) Fail("table: head after a row");
        continue;
      }
      head_done = true;
      if (Name(c) != "row") Fail("table holds <" + Name(c) + ">");
      ++rows;
      int n = 0;
      for (auto* k = c->FirstChildElement(); k; k = k->NextSiblingElement()) {
        if (Name(k) != "cell") Fail("row holds <" + Name(k) + ">");
        ++n;
      }
      cols = std::max(cols, n);
    }
    if (t->IntAttribute("rows", rows) != rows) Fail("table rows= does not count its rows");
    if (t->IntAttribute("cols", cols) != cols) Fail("table cols= does not count its cells");
  }

  std::vector<std::string> problems_;
  std::set<std::string> ids_, witnesses_, editors_;
};

}  // namespace apograph::testing

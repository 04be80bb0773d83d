#pragma once
/// The review page's list of findings with its filters and decision forms
/// (see pages.hpp).

#include <map>
#include <string>

#include "serve/pages.hpp"

namespace apograph::serve {

/// GET /: `query` holds the token and the filters (table, witness, class,
/// status) and an optional `done` message from the last decision.
HttpResponse FindingsPage(Site& site, const std::map<std::string, std::string>& query);

/// The list's query string for the filters a decision form carried back
/// (f_table, f_witness, f_class, f_status), with the token.
std::string ListQuery(const std::map<std::string, std::string>& form, const std::string& token);

}  // namespace apograph::serve

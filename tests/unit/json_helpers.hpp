// Helpers for building JSON documents in tests.
#pragma once
#include <initializer_list>
#include <nlohmann/json.hpp>

// nlohmann reads {{"a","b"}} as an object; arrays of arrays are built explicitly.
inline nlohmann::json A(std::initializer_list<nlohmann::json> items) {
  nlohmann::json out = nlohmann::json::array();
  for (const auto& item : items) out.push_back(item);
  return out;
}

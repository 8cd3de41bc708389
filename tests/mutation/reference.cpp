// Reference entry point: the common fields of §4.1, then the method's own rules.
#include "reference.hpp"

#include "ref_internal.hpp"

namespace mutref {

namespace {

std::string string_field(const json& c, const char* key) {
  const json& v = c.at(key);
  if (!v.is_string()) refuse(std::string("/") + key + ": not a string");
  return v.get<std::string>();
}

void verify_json(const Input& in, const json& c, const Options& opt) {
  if (!c.is_object()) refuse("the certificate is not an object");
  for (const char* key : {"format", "claim", "method", "input_sha256", "input_format"})
    if (!c.contains(key)) refuse(std::string("missing key ") + key);
  const std::string method = string_field(c, "method");
  std::set<std::string> keys{"format", "claim", "method", "input_sha256", "input_format"};
  std::string claim;
  if (method == "sheet") keys.insert({"ring", "frames", "winding", "triangles", "prisms"}), claim = "no-evasion";
  else if (method == "cocycle") keys.insert({"ring", "frames", "fence_value", "edges", "verticals"}), claim = "no-sheet";
  else if (method == "chambers") keys.insert({"square", "sensors", "slabs"}), claim = "no-evasion";
  else if (method == "route") keys.insert("route"), claim = "evasion";
  else refuse("/method: unknown method");
  keys_exactly(c, keys, {"notes"}, "");
  if (string_field(c, "format") != "sweepcert-certificate-1") refuse("/format: wrong format");
  if (string_field(c, "claim") != claim) refuse("/claim: does not go with the method");
  if (string_field(c, "input_sha256") != in.sha256) refuse("/input_sha256: not the input's hash");
  if (string_field(c, "input_format") != in.format) refuse("/input_format: not the input's format");
  bool z2 = false;
  if (keys.count("ring")) {
    std::string ring = string_field(c, "ring");
    if (ring != "z" && ring != "z2") refuse("/ring: must be z or z2");
    z2 = ring == "z2";
  }
  if (method == "sheet") verify_sheet(in, c, z2);
  else if (method == "cocycle") verify_cocycle(in, c, z2);
  else if (method == "chambers") verify_chambers(in, c);
  else verify_route(in, c, opt.route_samples);
}

}  // namespace

Verdict verify(const std::string& input_text, const std::string& cert_text, const Options& opt) {
  try {
    const Input& in = input_for(input_text);
    verify_json(in, parse_raw(cert_text), opt);
    return {true, ""};
  } catch (const Refuse& r) {
    return {false, r.why};
  } catch (const std::exception& e) {  // e.g. a value of the wrong JSON type met by .at()/.get()
    return {false, std::string("malformed: ") + e.what()};
  }
}

}  // namespace mutref

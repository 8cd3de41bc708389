// The input readers (checker/input.*): a scenario or contact log (built twice, as fuzz_scenario
// and fuzz_contacts, each started from seeds of its own format). Any bytes must give a valid
// Input or Unreadable; a valid Input is then queried as the certificate checks query it.
#include <cstddef>
#include <cstdint>
#include <memory>
#include <new>
#include <string_view>

#include "errors.hpp"
#include "input.hpp"
#include "json_reader.hpp"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  std::string_view bytes(reinterpret_cast<const char*>(data), size);
  try {
    sweepcheck::json::Document doc = sweepcheck::json::parse(bytes, "INPUT");
    std::unique_ptr<sweepcheck::Input> in = sweepcheck::load_input(doc);
    // Every listed pair and triple must be found again where the log lists it.
    if (in->kind == sweepcheck::InputKind::ContactLog) {
      for (std::size_t f = 0; f + 1 < in->pairs_begin.size(); ++f)
        for (std::size_t i = in->pairs_begin[f]; i < in->pairs_begin[f + 1]; ++i)
          if (in->pair_slot(in->frame_pairs[i], f) != i) __builtin_trap();
      for (std::size_t f = 0; f + 1 < in->triples_begin.size(); ++f)
        for (std::size_t i = in->triples_begin[f]; i < in->triples_begin[f + 1]; ++i)
          if (in->triple_slot(in->frame_triples[i], f) != i) __builtin_trap();
    }
    for (std::size_t v = 0; v < in->vertex_count(); ++v)
      if (in->find(in->names[v]) != std::int64_t(v)) __builtin_trap();
  } catch (const sweepcheck::Unreadable&) {
  } catch (const std::bad_alloc&) {
  }
  return 0;
}

#include "quadtree.hpp"

#include "errors.hpp"

namespace sweepcheck {

using json::Kind;
using json::Ref;

namespace {

std::int32_t read_token(Ref v, const std::string& pointer, std::size_t i, std::size_t table_size) {
  auto where = [&] { return pointer + "/" + std::to_string(i); };
  switch (v.kind()) {
    case Kind::Unsigned: {
      const std::uint64_t k = v.unsigned_value();
      if (k >= table_size)
        throw Rejected(where(), "", "sensor-table index " + std::to_string(k) + " out of range (the table `sensors` has " +
                                        std::to_string(table_size) + " entries, §4.5)");
      return static_cast<std::int32_t>(k);
    }
    case Kind::Signed: {
      const std::int64_t k = v.signed_value();
      if (k == -1 || k == -2 || k == -3) return static_cast<std::int32_t>(k);
      if (k == 0) throw Rejected(where(), "", "a cell token must not be written \"-0\" (§1.2, §4.5)");
      throw Rejected(where(), "", "invalid cell token " + std::to_string(k) +
                                      " (expected -1 split, -2 open, -3 outside or a sensor-table index k >= 0, §4.5)");
    }
    case Kind::Float:
      throw Rejected(where(), "", "a cell token must be a JSON integer without fraction or exponent, found " +
                                      std::string(v.text()) + " (§4.5)");
    default:
      throw Rejected(where(), "", std::string("a cell token must be a JSON integer, found ") + json::kind_name(v.kind()) +
                                      " (§4.5)");
  }
}

}  // namespace

Quadtree::Quadtree(Ref tree, const std::string& pointer, std::size_t table_size) {
  if (!tree.is(Kind::Array))
    throw Rejected(pointer, "", std::string("expected an array of cell tokens, found ") + json::kind_name(tree.kind()));
  const std::size_t n = tree.size();
  if (n == 0) throw Rejected(pointer, "", "empty tree: it must be exactly one complete tree (§4.5)");
  if (n > 0xFFFFFFF0u) throw Rejected(pointer, "", "too many nodes");
  nodes_.reserve(n);
  open_before_.reserve(n + 1);
  parent_.reserve(n);
  open_before_.push_back(0);
  // Open splits: node index and how many of its children have been started. At most 41 deep.
  struct Open { std::uint32_t node; std::uint8_t started; };
  std::vector<Open> stack;
  stack.reserve(kMaxDepth + 1);
  for (std::size_t i = 0; i < n; ++i) {
    if (i > 0 && stack.empty())
      throw Rejected(pointer + "/" + std::to_string(i), "",
                     "extra token after the complete tree: the tree ended at token " + std::to_string(i - 1) +
                         " (it must be exactly one complete tree, §4.5)");
    const std::int32_t token = read_token(tree[i], pointer, i, table_size);
    Node node{0, 0, static_cast<std::uint32_t>(i + 1), token, 0};
    if (!stack.empty()) {
      Open& parent = stack.back();
      const Node& p = nodes_[parent.node];
      const std::int64_t half = p.side() / 2;
      node.depth = static_cast<std::uint8_t>(p.depth + 1);
      node.x = p.x + ((parent.started & 1) ? half : 0);  // SW, SE, NW, NE
      node.y = p.y + ((parent.started & 2) ? half : 0);
      ++parent.started;
    }
    nodes_.push_back(node);
    parent_.push_back(stack.empty() ? 0 : stack.back().node);
    open_before_.push_back(open_before_.back() + (token == kOpen ? 1 : 0));
    if (token == kSplit) {
      if (node.depth >= kMaxDepth)
        throw Rejected(pointer + "/" + std::to_string(i), "",
                       "split of a cell at depth " + std::to_string(node.depth) + ": the depth is at most " +
                           std::to_string(kMaxDepth) + " (§4.5)");
      stack.push_back(Open{static_cast<std::uint32_t>(i), 0});
      continue;
    }
    // A leaf completes every open split whose fourth child it finishes.
    while (!stack.empty() && stack.back().started == 4) {
      nodes_[stack.back().node].end = static_cast<std::uint32_t>(i + 1);
      stack.pop_back();
    }
  }
  if (!stack.empty()) {
    const Open& o = stack.back();
    throw Rejected(pointer, "", "incomplete tree: the tokens end inside the split at " + pointer + "/" +
                                    std::to_string(o.node) + ", which has " + std::to_string(o.started) +
                                    " of its 4 children (it must be exactly one complete tree, §4.5)");
  }
}

}  // namespace sweepcheck

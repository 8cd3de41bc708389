#include <cstdio>
#include <stdexcept>
#include <unistd.h>

#include "cert/sink.hpp"

namespace sweepcert {

void append_json_string(std::string& out, const std::string& s) {
  out += '"';
  for (unsigned char ch : s) {
    if (ch == '"' || ch == '\\') { out += '\\'; out += static_cast<char>(ch); }
    else if (ch < 0x20) {
      char esc[8];
      std::snprintf(esc, sizeof esc, "\\u%04x", ch);
      out += esc;
    } else out += static_cast<char>(ch);
  }
  out += '"';
}

namespace {
void append_number(std::string& out, const Rational& q) {
  out += '"';
  out += to_text(q);
  out += '"';
}
void append_integer(std::string& out, const Integer& z) {
  out += '"';
  out += z.get_str();
  out += '"';
}
}  // namespace

JsonCertificateWriter::JsonCertificateWriter(std::string path)
    : path_(std::move(path)), tmp_(path_ + ".partial-" + std::to_string(::getpid())) {
  file_ = std::fopen(tmp_.c_str(), "wb");
  if (!file_) throw std::runtime_error("cannot write " + tmp_);
}

JsonCertificateWriter::~JsonCertificateWriter() {
  if (file_) std::fclose(file_);
  if (!committed_) std::remove(tmp_.c_str());
}

void JsonCertificateWriter::flush(bool force) {
  if (!force && buf_.size() < (1u << 20)) return;
  if (std::fwrite(buf_.data(), 1, buf_.size(), file_) != buf_.size())
    throw std::runtime_error("cannot write " + tmp_);
  written_ += buf_.size();
  buf_.clear();
}

void JsonCertificateWriter::begin(const CertificateHeader& h) {
  buf_ += "{\n \"format\": \"sweepcert-certificate-1\",\n \"claim\": ";
  append_json_string(buf_, h.claim);
  buf_ += ",\n \"method\": ";
  append_json_string(buf_, h.method);
  buf_ += ",\n \"input_sha256\": ";
  append_json_string(buf_, h.input_sha256);
  buf_ += ",\n \"input_format\": ";
  append_json_string(buf_, h.input_format);
  if (h.margin != 0) {
    buf_ += ",\n \"margin\": ";
    append_number(buf_, h.margin);
  }
  buf_ += ",\n \"notes\": ";
  buf_ += h.notes_json.empty() ? "{}" : h.notes_json;
  if (h.method == "sheet" || h.method == "cocycle") {
    buf_ += ",\n \"ring\": ";
    append_json_string(buf_, h.ring);
    buf_ += ",\n \"frames\": [";
    for (std::size_t i = 0; i < h.frames.size(); ++i) {
      if (i) buf_ += i % 16 ? ", " : ",\n  ";
      append_number(buf_, h.frames[i]);
    }
    buf_ += "]";
  }
}

void JsonCertificateWriter::open_array(const char* key) {
  if (section_ == key) return;
  if (!section_.empty()) buf_ += "\n ]";
  buf_ += ",\n \"";
  buf_ += key;
  buf_ += "\": [";
  section_ = key;
  first_row_ = true;
}

void JsonCertificateWriter::row_start() {
  buf_ += first_row_ ? "\n  [" : ",\n  [";
  first_row_ = false;
}

void JsonCertificateWriter::winding(const Integer& m) {
  buf_ += ",\n \"winding\": ";
  append_integer(buf_, m);
  open_array("triangles");
}

void JsonCertificateWriter::triangle(std::uint32_t frame, const std::string& a,
                                     const std::string& b, const std::string& c,
                                     const Integer& coef, const Point* w) {
  open_array("triangles");
  row_start();
  buf_ += std::to_string(frame);
  for (const std::string* id : {&a, &b, &c}) { buf_ += ", "; append_json_string(buf_, *id); }
  buf_ += ", ";
  append_integer(buf_, coef);
  if (w) {
    buf_ += ", ";
    append_number(buf_, w->x);
    buf_ += ", ";
    append_number(buf_, w->y);
  }
  buf_ += ']';
  flush(false);
}

void JsonCertificateWriter::prism(std::uint32_t slab, const std::string& a, const std::string& b,
                                  const Integer& coef) {
  open_array("prisms");
  row_start();
  buf_ += std::to_string(slab);
  buf_ += ", ";
  append_json_string(buf_, a);
  buf_ += ", ";
  append_json_string(buf_, b);
  buf_ += ", ";
  append_integer(buf_, coef);
  buf_ += ']';
  flush(false);
}

void JsonCertificateWriter::fence_value(const Integer& v) {
  buf_ += ",\n \"fence_value\": ";
  append_integer(buf_, v);
  open_array("edges");
}

void JsonCertificateWriter::edge_value(std::uint32_t frame, const std::string& a,
                                       const std::string& b, const Integer& value) {
  open_array("edges");
  row_start();
  buf_ += std::to_string(frame);
  buf_ += ", ";
  append_json_string(buf_, a);
  buf_ += ", ";
  append_json_string(buf_, b);
  buf_ += ", ";
  append_integer(buf_, value);
  buf_ += ']';
  flush(false);
}

void JsonCertificateWriter::vertical_value(std::uint32_t slab, const std::string& v,
                                           const Integer& value) {
  open_array("verticals");
  row_start();
  buf_ += std::to_string(slab);
  buf_ += ", ";
  append_json_string(buf_, v);
  buf_ += ", ";
  append_integer(buf_, value);
  buf_ += ']';
  flush(false);
}

void JsonCertificateWriter::chamber_square(const Rational& x0, const Rational& y0,
                                           const Rational& side,
                                           const std::vector<std::string>& sensors) {
  buf_ += ",\n \"square\": {\"origin\": [";
  append_number(buf_, x0);
  buf_ += ", ";
  append_number(buf_, y0);
  buf_ += "], \"side\": ";
  append_number(buf_, side);
  buf_ += "},\n \"sensors\": [";
  for (std::size_t i = 0; i < sensors.size(); ++i) {
    if (i) buf_ += ", ";
    append_json_string(buf_, sensors[i]);
  }
  buf_ += "]";
  open_array("slabs");
}

void JsonCertificateWriter::chamber_slab(const Rational& a, const Rational& b,
                                         const std::vector<int>& tree) {
  open_array("slabs");
  buf_ += first_row_ ? "\n  {\"t\": [" : ",\n  {\"t\": [";
  first_row_ = false;
  append_number(buf_, a);
  buf_ += ", ";
  append_number(buf_, b);
  buf_ += "], \"tree\": [";
  for (std::size_t i = 0; i < tree.size(); ++i) {
    if (i) buf_ += ',';
    buf_ += std::to_string(tree[i]);
    if (buf_.size() > (1u << 20)) flush(false);
  }
  buf_ += "]}";
  flush(false);
}

void JsonCertificateWriter::route_point(const Rational& t, const Rational& x, const Rational& y) {
  open_array("route");
  row_start();
  append_number(buf_, t);
  buf_ += ", ";
  append_number(buf_, x);
  buf_ += ", ";
  append_number(buf_, y);
  buf_ += ']';
  flush(false);
}

void JsonCertificateWriter::end() {
  // Sheets always carry both arrays and cocycles both theirs, even when empty.
  if (section_ == "triangles") open_array("prisms");
  if (section_ == "edges") open_array("verticals");
  buf_ += "\n ]\n}\n";
  flush(true);
}

void JsonCertificateWriter::commit() {
  if (std::fflush(file_) != 0 || std::fclose(file_) != 0) {
    file_ = nullptr;
    throw std::runtime_error("cannot write " + tmp_);
  }
  file_ = nullptr;
  if (std::rename(tmp_.c_str(), path_.c_str()) != 0)
    throw std::runtime_error("cannot move certificate into place at " + path_);
  committed_ = true;
}

}  // namespace sweepcert

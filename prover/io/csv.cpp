#include "io/csv.hpp"

#include <algorithm>

#include "io/input_error.hpp"
#include "io/read_input.hpp"

namespace sweepcert {

std::string CsvTable::where(const CsvField& f) const {
  return path + ":" + std::to_string(f.line) + ":" + std::to_string(f.column);
}

std::vector<std::vector<CsvField>> split_csv(const std::string& path, const std::string& bytes) {
  std::vector<std::vector<CsvField>> records;
  std::size_t i = 0, line = 1, line_start = 0;
  if (bytes.compare(0, 3, "\xEF\xBB\xBF") == 0) i = line_start = 3;  // spreadsheet byte-order mark
  auto here = [&](std::size_t at) {
    return path + ":" + std::to_string(line) + ":" + std::to_string(at - line_start + 1);
  };
  auto at_line_end = [&](std::size_t at) {
    return at == bytes.size() || bytes[at] == '\n' ||
           (bytes[at] == '\r' && at + 1 < bytes.size() && bytes[at + 1] == '\n');
  };
  std::vector<CsvField> record;
  while (i < bytes.size()) {
    CsvField field{"", line, i - line_start + 1};
    if (bytes[i] == '"') {
      std::size_t open = i++;
      std::string open_where = here(open);
      for (;;) {
        if (i == bytes.size())
          throw InputError(open_where, "unterminated quoted field (no closing '\"')");
        char c = bytes[i++];
        if (c == '"') {
          if (i < bytes.size() && bytes[i] == '"') { field.text += '"'; ++i; continue; }
          break;
        }
        if (c == '\n') { ++line; line_start = i; }
        field.text += c;
      }
      if (i < bytes.size() && bytes[i] != ',' && !at_line_end(i))
        throw InputError(here(i), "text after the closing quote of a quoted field");
    } else {
      while (i < bytes.size() && bytes[i] != ',' && !at_line_end(i)) {
        if (bytes[i] == '"') throw InputError(here(i), "quote inside an unquoted field");
        if (bytes[i] == '\r') throw InputError(here(i), "carriage return not followed by a line feed");
        field.text += bytes[i++];
      }
    }
    record.push_back(std::move(field));
    if (i < bytes.size() && bytes[i] == ',') {
      ++i;
      if (i == bytes.size()) record.push_back({"", line, i - line_start + 1});
      continue;
    }
    i += (i < bytes.size() && bytes[i] == '\r') ? 2 : 1;  // the line end (or past the end)
    ++line;
    line_start = i;
    records.push_back(std::move(record));
    record.clear();
  }
  if (!record.empty()) records.push_back(std::move(record));
  auto blank = [](const std::vector<CsvField>& r) { return r.size() == 1 && r[0].text.empty(); };
  while (!records.empty() && blank(records.back())) records.pop_back();
  return records;
}

CsvTable read_csv(const std::string& path, const std::vector<std::string>& columns) {
  auto records = split_csv(path, read_bytes(path));
  CsvTable table;
  table.path = path;
  if (records.empty()) throw InputError(path + ":1:1", "empty file (expected a header line)");
  const auto& header = records[0];
  std::string expected;
  for (const auto& n : columns) expected += (expected.empty() ? "" : ",") + n;
  for (std::size_t c = 0; c < header.size(); ++c) {
    const CsvField& f = header[c];
    if (f.text.empty())
      throw InputError(table.where(f), "empty column name in the header (column " +
                                           std::to_string(c + 1) + ")");
    if (std::find(columns.begin(), columns.end(), f.text) == columns.end())
      throw InputError(table.where(f),
                       "unknown column \"" + f.text + "\" (expected the columns " + expected + ")");
    for (std::size_t d = 0; d < c; ++d)
      if (header[d].text == f.text)
        throw InputError(table.where(f), "column \"" + f.text + "\" appears twice in the header");
    table.names.push_back(f.text);
  }
  for (const auto& name : columns) {
    auto it = std::find(table.names.begin(), table.names.end(), name);
    if (it == table.names.end())
      throw InputError(path + ":1:1", "missing column \"" + name + "\" in the header");
    table.wanted.push_back(static_cast<std::size_t>(it - table.names.begin()));
  }
  for (std::size_t r = 1; r < records.size(); ++r) {
    if (records[r].size() != header.size())
      throw InputError(path + ":" + std::to_string(records[r][0].line) + ":1",
                       "row has " + std::to_string(records[r].size()) + " fields, the header has " +
                           std::to_string(header.size()));
    table.rows.push_back(std::move(records[r]));
  }
  return table;
}

}  // namespace sweepcert

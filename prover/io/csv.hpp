// Reading comma-separated tables (RFC 4180) with every field's place in the file kept.
//
// Import tables come from spreadsheets and loggers, so the reader accepts what RFC 4180 allows
// (quoted fields with doubled quotes, commas and line breaks inside quotes, CRLF or LF line
// ends, a missing final line break) and nothing else; errors name "FILE:LINE:COLUMN". Columns
// are looked up by header name, so a table may list its columns in any order.
#pragma once
#include <string>
#include <vector>

namespace sweepcert {

struct CsvField {
  std::string text;
  std::size_t line = 0, column = 0;  // where the field starts, 1-based (column in bytes)
};

struct CsvTable {
  std::string path;
  std::vector<std::string> names;         // the header, in file order
  std::vector<std::size_t> wanted;        // for each requested name, its index in the header
  std::vector<std::vector<CsvField>> rows;  // data rows, each with names.size() fields

  // "FILE:LINE:COLUMN" of a field, for error messages.
  std::string where(const CsvField& f) const;
  // The field of requested column `k` (index into the `columns` given to read_csv) in row r.
  const CsvField& get(std::size_t r, std::size_t k) const { return rows[r][wanted[k]]; }
};

// Splits bytes into records; throws InputError on an unterminated quote or stray text after a
// closing quote. Blank lines at the end are dropped. Exposed for tests.
std::vector<std::vector<CsvField>> split_csv(const std::string& path, const std::string& bytes);

// Reads a table whose header must hold exactly the names in `columns` (any order). Throws
// InputError for a missing, unknown, empty or repeated column name, or a row whose field count
// differs from the header's.
CsvTable read_csv(const std::string& path, const std::vector<std::string>& columns);

}  // namespace sweepcert

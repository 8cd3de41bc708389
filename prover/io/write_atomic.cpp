#include "io/write_atomic.hpp"

#include <cstdio>
#include <fstream>
#include <stdexcept>

namespace sweepcert {

void write_file_atomically(const std::string& path, const std::string& bytes) {
  std::string tmp = path + ".partial";
  {
    std::ofstream f(tmp, std::ios::binary);
    f << bytes;
    f.flush();
    if (!f) {
      std::remove(tmp.c_str());
      throw std::runtime_error("cannot write " + tmp);
    }
  }
  if (std::rename(tmp.c_str(), path.c_str()) != 0) {
    std::remove(tmp.c_str());
    throw std::runtime_error("cannot move the output into place at " + path);
  }
}

}  // namespace sweepcert

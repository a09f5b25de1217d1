// Comments cite only documents that are in the repository, or published sources (DEVELOPERS.md,
// Conventions). A citation of docs/physics.md or docs/architecture.md names a section heading that
// exists, so a reader can follow it; a renamed heading fails here until its citations follow.
#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <regex>
#include <set>
#include <sstream>
#include <string>
#include <vector>

namespace {

namespace fs = std::filesystem;
const fs::path kRoot = FINESTRA_SOURCE_DIR;

std::string readAll(const fs::path& path) {
  std::ifstream in(path, std::ios::binary);
  std::ostringstream text;
  text << in.rdbuf();
  return text.str();
}

// Section headings (## and ###) of a Markdown document.
std::set<std::string> headings(const fs::path& document) {
  std::set<std::string> out;
  std::istringstream lines(readAll(document));
  for (std::string line; std::getline(lines, line);) {
    const auto start = line.find_first_not_of('#');
    if (start < 2 || start > 3 || start == std::string::npos || line[start] != ' ') continue;
    out.insert(line.substr(start + 1));
  }
  return out;
}

bool isSourceFile(const fs::path& path) {
  static const std::set<std::string> suffixes{".h", ".cpp", ".py", ".sh", ".cmake", ".txt"};
  return suffixes.count(path.extension().string()) > 0;
}

// Every source file of the folders whose comments cite documents.
std::vector<fs::path> sourceFiles() {
  std::vector<fs::path> out;
  for (const char* folder : {"core", "ui", "app", "tests", "scripts", "cmake"}) {
    if (!fs::exists(kRoot / folder)) continue;
    for (const auto& entry : fs::recursive_directory_iterator(kRoot / folder)) {
      const fs::path relative = fs::relative(entry.path(), kRoot);
      if (entry.is_regular_file() && isSourceFile(entry.path()) && relative.string().rfind("tests/data", 0) != 0)
        out.push_back(entry.path());
    }
  }
  return out;
}

// The text with comment continuations joined, so that a citation wrapped over two comment lines
// reads as one: "docs/physics.md,\n// Strain" becomes "docs/physics.md, Strain".
std::string joinedComments(const std::string& text) {
  static const std::regex continuation(R"(\n[ \t]*(//+[ \t]*|#+[ \t]+))");
  return std::regex_replace(text, continuation, " ");
}

}  // namespace

TEST(DocCitations, CitedSectionsExist) {
  const std::set<std::string> physics = headings(kRoot / "docs/physics.md");
  const std::set<std::string> architecture = headings(kRoot / "docs/architecture.md");
  ASSERT_FALSE(physics.empty());
  ASSERT_FALSE(architecture.empty());
  // A citation runs from the document's name to the end of the section name: ) ; : . or a quote.
  const std::regex citation(R"(docs/(physics|architecture)\.md, ([^);:."\n]+))");
  int cited = 0;
  for (const fs::path& file : sourceFiles()) {
    const std::string text = joinedComments(readAll(file));
    for (auto it = std::sregex_iterator(text.begin(), text.end(), citation); it != std::sregex_iterator(); ++it) {
      std::string section = (*it)[2].str();
      while (!section.empty() && (section.back() == ' ' || section.back() == '`')) section.pop_back();
      const std::set<std::string>& known = (*it)[1].str() == "physics" ? physics : architecture;
      // The sentence may go on after the heading ("Strain (Meesala et al. ...)"): accept a heading
      // that is the whole text or is followed by a space.
      bool found = false;
      for (const std::string& heading : known)
        if (section == heading || section.rfind(heading + " ", 0) == 0) found = true;
      EXPECT_TRUE(found) << fs::relative(file, kRoot).string() << " cites docs/" << (*it)[1].str() << ".md, \""
                         << section << "\", which is not a section heading there";
      ++cited;
    }
  }
  EXPECT_GT(cited, 10) << "the code cites the documents by section; the pattern no longer finds them";
}

TEST(DocCitations, NoDocumentOutsideTheRepositoryIsCited) {
  // Built from pieces so that this file does not match its own patterns.
  const std::string section = std::string("\xC2\xA7");  // the section sign of a numbered outside document
  const std::vector<std::string> forbidden{section, std::string("/wo") + "rk/", std::string("shared") + "/design",
                                           std::string("shared") + "/bench"};
  const std::regex bareDocument(R"((^|[^/])(physics|architecture)\.md)");
  for (const fs::path& file : sourceFiles()) {
    const std::string text = readAll(file);
    const std::string name = fs::relative(file, kRoot).string();
    for (const std::string& pattern : forbidden)
      EXPECT_EQ(text.find(pattern), std::string::npos) << name << " contains \"" << pattern << "\"";
    EXPECT_FALSE(std::regex_search(text, bareDocument))
        << name << " names a document of docs/ without its folder";
  }
}

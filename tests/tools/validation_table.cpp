// Builds docs/validation.md from the JSON report of the reference tests
// (reference_tests --gtest_output=json:FILE): every check recorded with record_published_check()
// (test properties named "check: ..."), grouped by test file in test order, with a summary of the
// checks per file and per source status, and each check's test name and outcome.
//   validation_table REPORT.json > docs/validation.md

#include <algorithm>
#include <array>
#include <fstream>
#include <iostream>
#include <sstream>
#include <string>
#include <string_view>
#include <vector>

#include <nlohmann/json.hpp>

namespace {

// ordered_json keeps the checks of a test in the order they were recorded.
using Json = nlohmann::ordered_json;

std::string cell(const std::string& text) {
  std::string out;
  for (const char c : text) out += c == '|' ? std::string("\\|") : std::string(1, c);
  return out;
}

std::string lower(std::string text) {
  for (char& c : text) {
    if (c >= 'A' && c <= 'Z') c = static_cast<char>(c - 'A' + 'a');
  }
  return text;
}

// The status words a source may name; a check counts under every one its source names.
struct Status {
  std::string_view heading;
  std::string_view marker;  // lower case, searched in the lower-cased source
};
constexpr std::array<Status, 4> kStatuses{{{"from memory", "from memory"},
                                           {"derived", "derived"},
                                           {"reproduction", "reproduction"},
                                           {"no published value", "none:"}}};

struct Check {
  std::string test;
  Json fields;
  bool passed = true;
};

struct TestFile {
  std::string path;
  std::vector<Check> checks;
};

// "tests/reference/x_test.cpp" from the absolute path gtest reports; the suite name if there is none.
std::string test_file(const Json& test, const std::string& suite) {
  if (!test.contains("file")) return suite;
  const std::string path = test.at("file").get<std::string>();
  const std::size_t tests = path.rfind("/tests/");
  if (tests != std::string::npos) return path.substr(tests + 1);
  const std::size_t slash = path.rfind('/');
  return slash == std::string::npos ? path : path.substr(slash + 1);
}

std::vector<TestFile> collect(const Json& report) {
  std::vector<TestFile> files;
  for (const auto& suite : report.at("testsuites")) {
    const std::string suite_name = suite.at("name").get<std::string>();
    for (const auto& test : suite.at("testsuite")) {
      const std::string name = suite_name + "." + test.at("name").get<std::string>();
      const bool passed = !test.contains("failures");
      for (const auto& [key, value] : test.items()) {
        if (key.rfind("check: ", 0) != 0) continue;
        const std::string path = test_file(test, suite_name);
        auto file = std::find_if(files.begin(), files.end(), [&path](const TestFile& f) { return f.path == path; });
        if (file == files.end()) file = files.insert(files.end(), TestFile{path, {}});
        file->checks.push_back({name, Json::parse(value.get<std::string>()), passed});
      }
    }
  }
  return files;
}

std::string summary_row(const std::string& label, const std::vector<Check>& checks) {
  std::ostringstream row;
  row << "| " << label << " | " << checks.size();
  for (const Status& status : kStatuses) {
    std::size_t count = 0;
    for (const Check& check : checks) {
      if (lower(check.fields.at("source").get<std::string>()).find(status.marker) != std::string::npos) ++count;
    }
    row << " | " << count;
  }
  std::size_t failed = 0;
  for (const Check& check : checks) failed += check.passed ? 0 : 1;
  row << " | " << failed << " |\n";
  return row.str();
}

}  // namespace

int main(int argc, char** argv) {
  if (argc != 2) {
    std::cerr << "usage: validation_table REPORT.json\n";
    return 2;
  }
  std::ifstream in(argv[1]);
  if (!in) {
    std::cerr << "validation_table: cannot read " << argv[1] << "\n";
    return 2;
  }
  const std::vector<TestFile> files = collect(Json::parse(in));

  std::cout << "# Validation against published sources\n\n"
               "Every check of the test suite against a published source, generated from the reference tests\n"
               "(`tests/reference/`) by `scripts/validation-table`. Do not edit by hand: the CTest test\n"
               "`validation.table_is_current` fails when this table and the tests disagree. A source marked\n"
               "*from memory* was recalled without the publication at hand and has a looser tolerance; *derived*\n"
               "means computed from published figures by the formula the test states; *reproduction* means the\n"
               "figure was taken from a document that reproduces the original publication.\n\n"
               "The *stackbound* column is the value the test asserts, in the unit of the *published* column; the\n"
               "*result* is that of the test holding the check.\n\n"
               "## Summary\n\n"
               "A check counts under every status its source names; the others cite the publication directly.\n\n"
               "| test file | checks |";
  for (const Status& status : kStatuses) std::cout << " " << status.heading << " |";
  std::cout << " failed |\n|---|---|";
  for (std::size_t i = 0; i < kStatuses.size(); ++i) std::cout << "---|";
  std::cout << "---|\n";
  std::vector<Check> all;
  for (const TestFile& file : files) {
    std::cout << summary_row("`" + cell(file.path) + "`", file.checks);
    all.insert(all.end(), file.checks.begin(), file.checks.end());
  }
  std::cout << summary_row("all", all);

  for (const TestFile& file : files) {
    std::cout << "\n## " << file.path << "\n\n"
              << file.checks.size() << (file.checks.size() == 1 ? " check" : " checks") << ".\n\n"
              << "| test | quantity | conditions | published | source | tolerance and why | stackbound | result |\n"
                 "|---|---|---|---|---|---|---|---|\n";
    for (const Check& check : file.checks) {
      const auto field = [&check](const char* name) { return cell(check.fields.at(name).get<std::string>()); };
      std::cout << "| " << cell(check.test) << " | " << field("quantity") << " | " << field("conditions") << " | "
                << field("published") << " | " << field("source") << " | " << field("tolerance") << " | "
                << field("tool") << " | " << (check.passed ? "pass" : "FAIL") << " |\n";
    }
  }
  std::cout << "\n" << all.size() << " checks.\n";
  return 0;
}

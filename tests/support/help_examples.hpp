#pragma once
// The examples a command's --help prints ("  stackbound fuel --gas \"CH4 95 %, ...\" ..."), split into
// arguments the way a shell splits them (blanks; double quotes group; a line ending in " \" goes on), so
// that tests can run every example as written.

#include <algorithm>
#include <string>
#include <string_view>
#include <vector>

namespace stackbound::testing {

// The lines of `text`, with a line ending in " \" joined to the next one (the backslash removed).
inline std::vector<std::string> joined_lines(std::string_view text) {
  std::vector<std::string> lines;
  bool continued = false;
  std::size_t start = 0;
  while (start < text.size()) {
    const std::size_t end = std::min(text.find('\n', start), text.size());
    const std::string line(text.substr(start, end - start));
    if (continued) {
      lines.back() += line;
    } else {
      lines.push_back(line);
    }
    continued = lines.back().ends_with(" \\");
    if (continued) lines.back().pop_back();
    start = end + 1;
  }
  return lines;
}

// The arguments after "stackbound" of every example line of `help` that starts with "  stackbound
// <command>"; a trailing "(...)" remark is left out.
inline std::vector<std::vector<std::string>> help_examples(std::string_view help, std::string_view command) {
  constexpr std::string_view kProgram = "  stackbound ";
  const std::string prefix = std::string(kProgram) + std::string(command);
  std::vector<std::vector<std::string>> examples;
  for (const std::string& line : joined_lines(help)) {
    if (!line.starts_with(prefix) || (line.size() > prefix.size() && line[prefix.size()] != ' ')) continue;
    std::vector<std::string> arguments;
    std::string current;
    bool quoted = false;
    bool have = false;
    for (const char c : line.substr(kProgram.size())) {
      if (c == '"') {
        quoted = !quoted;
        have = true;
      } else if ((c == ' ' || c == '\t') && !quoted) {
        if (have) arguments.push_back(current);
        current.clear();
        have = false;
      } else {
        current += c;
        have = true;
      }
    }
    if (have) arguments.push_back(current);
    const auto remark = std::find_if(arguments.begin(), arguments.end(),
                                     [](const std::string& argument) { return argument.starts_with("("); });
    arguments.erase(remark, arguments.end());
    examples.push_back(arguments);
  }
  return examples;
}

// The subcommand names the top-level --help lists under "Subcommands:".
inline std::vector<std::string> help_subcommands(std::string_view help) {
  std::vector<std::string> names;
  bool inside = false;
  for (const std::string& line : joined_lines(help)) {
    if (line.starts_with("Subcommands:")) {
      inside = true;
    } else if (inside && line.starts_with("  ") && line.size() > 2 && line[2] != ' ') {
      names.push_back(line.substr(2, line.find(' ', 2) - 2));
    } else if (inside && !line.starts_with(" ")) {
      inside = false;
    }
  }
  return names;
}

}  // namespace stackbound::testing

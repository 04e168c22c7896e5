// Loading YAML documents: what the YAML library would accept in silence or report in its own words is
// refused with a located message of ours.

#include <gtest/gtest.h>

#include <string>

#include "stackbound/cases/case_file.hpp"
#include "stackbound/cases/species_file.hpp"
#include "stackbound/cases/yaml_document.hpp"
#include "stackbound/units/input_error.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::cases {
namespace {

using namespace std::string_literals;

// Wrong if a key that is a list ("[x]: 1") escaped as the YAML library's "bad conversion".
TEST(YamlDocument, AKeyThatIsAListOrMappingIsRefusedAtItsPosition) {
  EXPECT_THROW_WITH((void)load_yaml_document("case:\n  [x]: 1\n", "f.yaml"), units::InputError,
                    "f.yaml:2:3: a key must be a plain name, not a list or mapping");
  EXPECT_THROW_WITH((void)load_yaml_document("? a: b\n: 1\n", "f.yaml"), units::InputError,
                    "f.yaml:1:3: a key must be a plain name, not a list or mapping");
  EXPECT_THROW_WITH((void)parse_case("[x]: 1\n", "c.yaml"), units::InputError, "c.yaml:1:1: a key must be a plain name");
  EXPECT_THROW_WITH((void)parse_species_yaml("species:\n  - {[f]: 1}\n", "s.yaml"), units::InputError,
                    "s.yaml:2:6: a key must be a plain name");
}

// Wrong if a key given twice kept one value in silence (excess_air twice).
TEST(YamlDocument, AKeyGivenTwiceIsRefusedWithBothLines) {
  EXPECT_THROW_WITH((void)load_yaml_document("operating_point:\n  excess_air: 10 %\n  excess_air: 20 %\n", "f.yaml"),
                    units::InputError, "f.yaml:3:3: key \"excess_air\" is given twice (lines 2 and 3); keep one");
}

// Wrong if one invalid byte in a title passed the load and failed later in the JSON renderer.
TEST(YamlDocument, InvalidUtf8IsRefusedWithItsPosition) {
  EXPECT_THROW_WITH((void)load_yaml_document("case:\n  title: Kessel \xFC" "ber\n", "f.yaml"), units::InputError,
                    "f.yaml:2:17: byte 0xFC is not valid UTF-8; save the file as UTF-8");
  EXPECT_THROW_WITH((void)load_yaml_document("a: \xED\xA0\x80\n", "f.yaml"), units::InputError,
                    "byte 0xED is not valid UTF-8");  // a UTF-16 surrogate
  EXPECT_NO_THROW((void)load_yaml_document("title: Kesselhaus S\xC3\xBC" "d, 20 \xC2\xB0" "C\n", "f.yaml"));
}

// Wrong if a NUL in a description, or a "\0" or "\N" escape in a quoted value, passed the load: the
// YAML library keeps the NUL and turns "\N" into the lone byte 0x85, which stopped the JSON renderer
// (found by fuzzing the case run).
TEST(YamlDocument, ControlCharactersAreRefusedInTheFileAndAfterEscapes) {
  EXPECT_THROW_WITH((void)load_yaml_document("case:\n  description: >-\n    a\0b\n"s, "f.yaml"),
                    units::InputError, "f.yaml:3:6: control character U+0000 is not allowed in a text file; remove it");
  EXPECT_THROW_WITH((void)load_yaml_document("case:\n  title: \"H-101 \\N\"\n", "f.yaml"), units::InputError,
                    "f.yaml:2:10: an escape in this value (such as \\0 or \\N) gives text that is not plain: byte 0x85 "
                    "is not valid UTF-8 (byte 7 of the value); write the value without it");
  EXPECT_THROW_WITH((void)load_yaml_document("case:\n  \"ti\\0tle\": x\n", "f.yaml"), units::InputError,
                    "gives text that is not plain: control character U+0000");
  EXPECT_NO_THROW((void)load_yaml_document("case:\n  title: \"a\\tb \\u00B0\"\n", "f.yaml"))
      << "a tab and a degree sign by escape are plain text";
}

// Wrong if 100 000 nested brackets gave "not valid YAML: bad file" (or exhausted the stack).
TEST(YamlDocument, DeepNestingIsRefusedBeforeParsing) {
  const std::string deep = "a: " + std::string(100000, '[') + std::string(100000, ']') + "\n";
  EXPECT_THROW_WITH((void)load_yaml_document(deep, "f.yaml"), units::InputError,
                    "f.yaml:1:68: lists and mappings nest deeper than 64 levels here");
  const std::string quoted = "a: \"" + std::string(100, '[') + "\"\n";
  EXPECT_NO_THROW((void)load_yaml_document(quoted, "f.yaml")) << "brackets inside a quoted text do not nest";
}

}  // namespace
}  // namespace stackbound::cases

// Plain text: what an input may hold (UTF-8 without stray control characters) and how a doubtful text
// is shown in a message.

#include <gtest/gtest.h>

#include <optional>
#include <string>

#include "stackbound/units/input_error.hpp"
#include "stackbound/units/plain_text.hpp"
#include "tests/support/tolerance.hpp"

namespace stackbound::units {
namespace {

// Wrong if a NUL, a C1 control (U+0085 as C2 85), DEL or an invalid byte passed as plain text: each
// reached the JSON renderer as bytes it refuses.
TEST(PlainText, ControlCharactersAndInvalidBytesAreFaultsAtTheirOffset) {
  const auto fault_at = [](std::string_view text) {
    const std::optional<TextFault> fault = find_text_fault(text);
    return fault ? static_cast<long>(fault->offset) : -1L;
  };
  EXPECT_EQ(fault_at(std::string_view("ab\0c", 4)), 2);
  EXPECT_EQ(fault_at("x \xC2\x85 y"), 2);
  EXPECT_EQ(fault_at("\x7F"), 0);
  EXPECT_EQ(fault_at("ok \x85"), 3);
  EXPECT_EQ(fault_at("\xC0\xAF"), 0) << "an overlong '/'";
  EXPECT_EQ(fault_at("\xF4\x90\x80\x80"), 0) << "above U+10FFFF";
  EXPECT_EQ(fault_at("tab\there\r\nline two, 20 \xC2\xB0" "C, \xE2\x82\x82, \xF0\x9F\x94\xA5"), -1)
      << "tab, CR, LF and any printable character are plain text";
  EXPECT_EQ(find_text_fault("\x01")->what, "control character U+0001 is not allowed in a text file");
  EXPECT_EQ(find_text_fault("\xFF")->what, "byte 0xFF is not valid UTF-8");
}

// Wrong if a message showed a raw control or invalid byte (it could break a line or a JSON document)
// or mangled a valid character.
TEST(PlainText, PrintableEscapesWhatIsNotPlainAndKeepsTheRest) {
  EXPECT_EQ(printable(std::string_view("a\0b", 3)), "a\\x00b");
  EXPECT_EQ(printable("1\t2\n3\r"), "1\\t2\\n3\\r");
  EXPECT_EQ(printable("x\xC2\x85y"), "x\\u0085y");
  EXPECT_EQ(printable("\xFF\xFE" "ab"), "\\xff\\xfeab");
  EXPECT_EQ(printable("20 \xC2\xB0" "C"), "20 \xC2\xB0" "C");
  EXPECT_FALSE(find_text_fault(printable(std::string_view("\0\x85\xC2\x9F\x7F", 5))).has_value())
      << "what printable returns is plain text itself";
}

// Wrong if the refusal did not name the file, line and column of the byte.
TEST(PlainText, RequirePlainTextNamesThePosition) {
  EXPECT_THROW_WITH(require_plain_text(std::string_view("a: 1\nb: x\0\n", 11), "f.yaml"), InputError,
                    "f.yaml:2:5: control character U+0000 is not allowed in a text file; remove it");
  EXPECT_NO_THROW(require_plain_text("a: 1\n", "f.yaml"));
}

}  // namespace
}  // namespace stackbound::units

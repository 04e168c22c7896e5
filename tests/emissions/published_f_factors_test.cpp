// The published F-factor table (Method 19 Table 19-2) as carried into emissions/published_f_factors.cpp,
// checked entry by entry against the printed figures, and the presets' fuel types.

#include "stackbound/emissions/published_f_factors.hpp"

#include <gtest/gtest.h>

namespace stackbound::emissions {
namespace {

// Wrong if a figure were mistyped when the table was carried in.
TEST(PublishedFFactors, EveryEntryHasThePrintedFigures) {
  // Source: 40 CFR 75 Appendix F, Table 1 (Fd, Fc; same values as Method 19 Table 19-2) and Method 19
  // Table 19-2 (Fw, from memory), per 10^6 Btu at 20 degC, 29.92 in Hg.
  const struct {
    const char* key;
    double fd, fw, fc;  // fw 0: none listed
  } printed[] = {{"coal_anthracite", 10100, 10540, 1970}, {"coal_bituminous", 9780, 10640, 1800},
                 {"coal_lignite", 9860, 11950, 1910},     {"oil", 9190, 10320, 1420},
                 {"natural_gas", 8710, 10610, 1040},      {"propane", 8710, 10200, 1190},
                 {"butane", 8710, 10390, 1250},           {"wood", 9240, 0, 1830},
                 {"wood_bark", 9600, 0, 1920}};
  ASSERT_EQ(published_f_factors().size(), std::size(printed));
  for (const auto& row : printed) {
    const PublishedFFactors* entry = find_published_f_factors(row.key);
    ASSERT_NE(entry, nullptr) << row.key;
    EXPECT_EQ(entry->fd_dscf_per_MMBtu, row.fd) << row.key;
    EXPECT_EQ(entry->fc_scf_per_MMBtu, row.fc) << row.key;
    EXPECT_EQ(entry->fw_wscf_per_MMBtu.value_or(0.0), row.fw) << row.key;
  }
  EXPECT_EQ(find_published_f_factors("coal"), nullptr);
}

// Wrong if a preset took another fuel type's factors (oil presets are "oil", wood chips "wood").
TEST(PublishedFFactors, PresetsMapToTheirFuelType) {
  EXPECT_EQ(published_f_factors_of_preset("natural_gas")->key, "natural_gas");
  EXPECT_EQ(published_f_factors_of_preset("distillate_oil_no2")->key, "oil");
  EXPECT_EQ(published_f_factors_of_preset("residual_oil_no6")->key, "oil");
  EXPECT_EQ(published_f_factors_of_preset("bituminous_coal")->key, "coal_bituminous");
  EXPECT_EQ(published_f_factors_of_preset("wood_chips")->key, "wood");
  EXPECT_EQ(published_f_factors_of_preset("unknown"), nullptr);
}

}  // namespace
}  // namespace stackbound::emissions

// Comparisons of cases on different reference bases and with different pollutants: each case's column
// names its own basis, figures at the reference O2 are not differenced across bases, and cases are
// aligned on the union of their pollutants.

#include "stackbound/cases/comparison.hpp"

#include <gtest/gtest.h>

#include <cmath>
#include <string>

#include "stackbound/cases/species_file.hpp"

namespace stackbound::cases {
namespace {

std::string example(const char* name) { return std::string(STACKBOUND_SOURCE_DIR) + "/cases/examples/" + name; }

std::size_t column_of(const Comparison& c, const std::string& key) {
  for (std::size_t k = 0; k < c.columns.size(); ++k) {
    if (c.columns[k].key == key) return k;
  }
  ADD_FAILURE() << "no column " << key;
  return 0;
}

// The document's row of a metric column (rows follow the columns).
const std::vector<std::string>& row_of(const Report& report, const Comparison& c, const std::string& key) {
  return report.tables.front().rows.at(column_of(c, key));
}

// Wrong if the second case's figures sat under the first case's reference O2, or were differenced
// against figures on another basis.
TEST(Comparison, CasesOnDifferentBasesAreLabelledAndNotDifferencedAtTheReference) {
  const Comparison c = compare({example("gas_boiler.yaml"), example("gas_turbine.yaml")}, builtin_species());
  ASSERT_TRUE(c.bases_differ);
  EXPECT_EQ(c.bases[0], "@ 3 % O2 (21 % air), normal 0C");
  EXPECT_EQ(c.bases[1], "@ 15 % O2 (20.9 % air), normal 0C");
  const Report report = comparison_document(c, make_provenance(c.runs.front().definition, {}));
  const ReportTable& table = report.tables.front();
  EXPECT_EQ(table.columns[1], "A [@ 3 % O2 (21 % air), normal 0C]");
  EXPECT_EQ(table.columns[2], "B [@ 15 % O2 (20.9 % air), normal 0C]");
  // The header of a figure at the reference O2 names no single O2.
  EXPECT_EQ(c.columns[column_of(c, "NOx_mg_per_Nm3_at_ref_o2")].header, "NOx bound [mg/Nm3 @ reference O2]");
  const std::vector<std::string>& at_reference = row_of(report, c, "NOx_mg_per_Nm3_at_ref_o2");
  EXPECT_NE(at_reference[1], "-");
  EXPECT_NE(at_reference[2], "-");
  EXPECT_EQ(at_reference[3], "-");  // B - A
  EXPECT_EQ(at_reference[4], "-");  // (B - A)/A
  const std::vector<std::string>& ppmvd = row_of(report, c, "NOx_ppmvd");
  EXPECT_NE(ppmvd[3], "-");  // ppmvd as measured does not depend on the reference basis
  EXPECT_EQ(c.flags.back(),
            "The cases are on different reference bases (A @ 3 % O2 (21 % air), normal 0C; B @ 15 % O2 (20.9 % air), "
            "normal 0C): each case's figures at the reference O2 are on its own basis, named in its column, and are "
            "not differenced; compare ppmvd, kg/h or lb/MMBtu across them.");
}

// Wrong if cases listing different pollutants were refused, or a pollutant one case does not report
// got a number (or a difference) for it.
TEST(Comparison, DifferentPollutantsAreAlignedOnTheUnion) {
  const Comparison c = compare({example("gas_boiler.yaml"), example("oil_heater.yaml")}, builtin_species());
  const std::size_t so2 = column_of(c, "SO2_ppmvd");
  EXPECT_TRUE(c.columns[so2].may_be_missing);
  EXPECT_TRUE(std::isnan(c.values[0][so2]));
  EXPECT_GT(c.values[1][so2], 0.0);
  const Report report = comparison_document(c, make_provenance(c.runs.front().definition, {}));
  const std::vector<std::string>& row = row_of(report, c, "SO2_ppmvd");
  EXPECT_EQ(row[1], "-");
  EXPECT_NE(row[2], "-");
  EXPECT_EQ(row[3], "-");
  EXPECT_EQ(c.flags.front(),
            "Case B (" + example("oil_heater.yaml") + ") reports CO, NO, NOx, SO2; case A (" +
                example("gas_boiler.yaml") +
                ") reports CO, NO, NOx: the cases are compared on the union of their pollutants, with \"-\" where a "
                "case does not report one.");
}

// Wrong if cases on the same basis lost their differences or got a note they do not need.
TEST(Comparison, CasesOnTheSameBasisAreDifferencedEverywhere) {
  const Comparison c = compare({example("gas_boiler.yaml"), example("gas_boiler.yaml")}, builtin_species());
  EXPECT_FALSE(c.bases_differ);
  EXPECT_TRUE(c.flags.empty());
  const Report report = comparison_document(c, make_provenance(c.runs.front().definition, {}));
  EXPECT_EQ(row_of(report, c, "NOx_mg_per_Nm3_at_ref_o2")[3], "+0");  // B - A
  EXPECT_EQ(c.columns[column_of(c, "NOx_mg_per_Nm3_at_ref_o2")].header, "NOx bound [mg/Nm3 @ 3 % O2]");
}

}  // namespace
}  // namespace stackbound::cases

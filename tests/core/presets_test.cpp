// Preset completeness: every value of every built-in preset carries a unit, a source and a status.
#include <gtest/gtest.h>

#include "core/centre/presets.h"
#include "core/common/errors.h"

using namespace finestra;

TEST(Presets, AllFourCentresArePresent) {
  for (const char* name : {"SiV-", "GeV-", "SnV-", "PbV-"}) EXPECT_NO_THROW(findPreset(name)) << name;
}

TEST(Presets, EveryValueHasSourceAndStatus) {
  for (const Preset& p : builtinPresets()) {
    for (const ParamInfo& info : paramTable()) {
      if (info.hyperfine) continue;
      const ValueProvenance& v = p.values[static_cast<std::size_t>(info.id)];
      EXPECT_NE(v.status, ValueStatus::NotUsed) << p.name << " " << info.key;
      EXPECT_FALSE(v.source.empty()) << p.name << " " << info.key;
      EXPECT_EQ(v.unit, std::string(info.unit == "PHz/strain" ? "PHz/strain" : info.unit)) << p.name << " " << info.key;
      EXPECT_EQ(v.status == ValueStatus::Unknown, !std::isfinite(v.value)) << p.name << " " << info.key;
    }
    for (const auto& [iso, table] : p.isotopes)
      for (const ParamInfo& info : paramTable())
        if (info.hyperfine) {
          ASSERT_TRUE(table[static_cast<std::size_t>(info.id)].has_value()) << p.name << " " << iso << " " << info.key;
          EXPECT_FALSE(table[static_cast<std::size_t>(info.id)]->source.empty());
        }
  }
}

TEST(Presets, UnknownPresetNamesTheAlternatives) {
  try {
    findPreset("XeV-");
    FAIL();
  } catch (const InputError& e) {
    EXPECT_NE(std::string(e.what()).find("centre.preset"), std::string::npos);
    EXPECT_NE(std::string(e.what()).find("SiV-"), std::string::npos);
  }
}

TEST(Presets, PbVExcitedSplittingIsUnknownAndBlocksComputation) {
  // docs/physics.md, Provenance of values: λ_u of PbV⁻ has no value at hand; the user must set it.
  const ResolvedCentre c = resolveCentre("PbV-", std::nullopt, {});
  try {
    c.parameters.validateForComputation();
    FAIL();
  } catch (const MissingValueError& e) {
    EXPECT_NE(std::string(e.what()).find("lambda_u_GHz"), std::string::npos) << e.what();
  }
}

TEST(Presets, IsotopeWithoutHyperfineValuesIsAClearError) {
  const ResolvedCentre c = resolveCentre("GeV-", std::string("73Ge"), {});
  try {
    c.parameters.validateForComputation();
    FAIL();
  } catch (const MissingValueError& e) {
    EXPECT_NE(std::string(e.what()).find("A_par_g_MHz"), std::string::npos) << e.what();
  }
}

TEST(Presets, OverridesWinAndAreMarkedUserSet) {
  const ResolvedCentre c = resolveCentre("SiV-", std::nullopt, {{"lambda_g_GHz", 50.0}});
  EXPECT_DOUBLE_EQ(c.parameters.get(Param::LambdaG), 50.0);
  EXPECT_EQ(c.provenance[static_cast<std::size_t>(Param::LambdaG)].status, ValueStatus::UserSet);
  EXPECT_THROW(resolveCentre("SiV-", std::nullopt, {{"lambda_q_GHz", 1.0}}), InputError);
}

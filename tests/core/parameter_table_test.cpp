// The parameter table: complete (every centre key, every fit parameter), every entry usable by the
// reader, the CLI, the GUI and the fit; the reader's range messages name the key and the range.
#include <gtest/gtest.h>

#include <cmath>
#include <set>
#include <string>

#include "core/centre/parameter_table.h"
#include "core/centre/presets.h"
#include "core/common/error_location.h"
#include "core/common/errors.h"
#include "core/fit/fit_parameters.h"
#include "core/io/project_file.h"
#include "core/io/spectrum_csv.h"
#include "core/planner/planner.h"
#include "core/thermal/thermal_scan.h"

namespace finestra {
namespace {

std::string projectText(const std::string& fieldAndMore) {
  return R"({"format": "finestra-project", "version": 1, "centre": {"preset": "SiV-"}, )" + fieldAndMore + "}";
}

// The error of parsing `text` as "p.json"; fails the test when the text is accepted.
InputError parseError(const std::string& text) {
  try {
    parseProject(text, "p.json");
  } catch (const InputError& e) {
    return e;
  }
  ADD_FAILURE() << "accepted: " << text;
  return InputError("", "");
}

TEST(ParameterTable, EveryEntryHasUnitRangeScaleStepAndHelp) {
  std::set<std::string> keys, fitNames;
  for (const QuantitySpec& q : quantityTable()) {
    SCOPED_TRACE(q.key);
    EXPECT_TRUE(keys.insert(q.key).second) << "key listed twice";
    if (!q.fitName.empty()) {
      EXPECT_TRUE(fitNames.insert(q.fitName).second) << "fit name listed twice";
    }
    EXPECT_FALSE(q.unit.empty());
    EXPECT_TRUE(std::isfinite(q.minimum) && std::isfinite(q.maximum));
    EXPECT_LT(q.minimum, q.maximum);
    EXPECT_GT(q.fitScale, 0);
    EXPECT_GT(q.guiStep, 0);
    EXPECT_LE(q.guiStep, q.maximum - q.minimum);
    EXPECT_FALSE(q.help.empty());
  }
}

TEST(ParameterTable, EveryCentreKeyHasAnEntry) {
  for (const ParamInfo& info : paramTable()) {
    const QuantitySpec& q = quantity("centre.parameters." + std::string(info.key));
    EXPECT_EQ(q.fitName, info.key);
    EXPECT_EQ(q.help, info.meaning);
  }
}

// No silent scale of 1: every fit parameter takes unit and scale from the table.
TEST(ParameterTable, EveryFitParameterTakesItsScaleFromTheTable) {
  const std::vector<std::string> names = allFitParameterNames();
  EXPECT_EQ(names.size(), static_cast<std::size_t>(kParamCount) + 14);
  for (const std::string& name : names) {
    SCOPED_TRACE(name);
    const auto q = findFitQuantity(name);
    ASSERT_TRUE(q.has_value());
    const auto spec = findFitParameter(name);
    ASSERT_TRUE(spec.has_value());
    EXPECT_EQ(spec->scale, q->fitScale);
    EXPECT_EQ(spec->unit, q->unit == "1" ? "" : q->unit);
  }
  EXPECT_FALSE(findFitQuantity("field.magnitude_T").has_value());  // a project key, not a fit name
}

// Every value a built-in preset gives (and every isotope value) lies in the range the reader
// accepts for an override, so a project may always restate its preset.
TEST(ParameterTable, PresetValuesLieInTheirRanges) {
  for (const Preset& preset : builtinPresets()) {
    for (const ParamInfo& info : paramTable()) {
      const QuantitySpec& q = quantity("centre.parameters." + std::string(info.key));
      const auto i = static_cast<std::size_t>(info.id);
      const double v = preset.values[i].value;
      if (std::isfinite(v)) {
        EXPECT_NO_THROW(requireInRange(q, v, q.key)) << preset.name << " " << info.key;
      }
      for (const auto& [isotope, values] : preset.isotopes) {
        if (values[i] && std::isfinite(values[i]->value)) {
          EXPECT_NO_THROW(requireInRange(q, values[i]->value, q.key)) << preset.name << " " << isotope;
        }
      }
    }
  }
}

TEST(ParameterTable, OneFieldLimitForReaderAndPlanner) {
  EXPECT_EQ(quantity("field.magnitude_T").maximum, kMaxFieldT);
  EXPECT_EQ(quantity("field.vector_T").maximum, kMaxFieldT);
  EXPECT_NO_THROW(parseProject(projectText(R"("field": {"magnitude_T": 1000})"), "p.json"));
  const InputError e = parseError(projectText(R"("field": {"magnitude_T": 1000.5})"));
  EXPECT_EQ(e.keyPath(), "p.json: field.magnitude_T");
  EXPECT_NE(e.message().find("0 \u2026 1000 T"), std::string::npos) << e.message();
}

TEST(ParameterTable, ReaderMessagesNameTheKeyAndTheRange) {
  struct Case {
    std::string body, keyPath, range;
  };
  const std::vector<Case> cases{
      {R"("centre": {"preset": "SiV-", "parameters": {"lambda_g_GHz": -5}})", "p.json: centre.parameters.lambda_g_GHz",
       "0 \u2026 100000 GHz"},
      {R"("conditions": {"temperature_K": 1001})", "p.json: conditions.temperature_K", "0 \u2026 1000 K"},
      {R"("conditions": {"bath_t2star_s": 0})", "p.json: conditions.bath_t2star_s", "1e-12 \u2026 1000000 s"},
      {R"("centre": {"preset": "SiV-", "zpl_anchor": {"line": "C", "wavelength_nm": 99}})",
       "p.json: centre.zpl_anchor.wavelength_nm", "100 \u2026 2000 nm"},
      {R"("centre": {"preset": "SiV-", "assumed": {"debye_waller": 1.5}})", "p.json: centre.assumed.debye_waller",
       "0 \u2026 1"},
      {R"("field": {"magnitude_T": 1, "polar_deg": 181})", "p.json: field.polar_deg", "0 \u2026 180 deg"},
      {R"("magnet": {"tilt_deg": 91})", "p.json: magnet.tilt_deg", "-90 \u2026 90 deg"},
      {R"("strain": {"crystal": {"xy": 2}})", "p.json: strain.crystal.xy", "-0.05 \u2026 0.05"},
      {R"("strain": {"eg_excited": {"magnitude_GHz": -1}})", "p.json: strain.eg_excited.magnitude_GHz",
       "0 \u2026 100000 GHz"},
      {R"("fit": {"starts": 0})", "p.json: fit.starts", "1 \u2026 1000"},
  };
  for (const Case& c : cases) {
    std::string text = c.body.rfind(R"("centre")", 0) == 0
                           ? R"({"format": "finestra-project", "version": 1, )" + c.body + "}"
                           : projectText(c.body);
    const InputError e = parseError(text);
    EXPECT_EQ(e.keyPath(), c.keyPath) << e.what();
    EXPECT_NE(e.message().find(c.range), std::string::npos) << e.message();
    EXPECT_EQ(std::string(e.what()), c.keyPath + ": " + e.message());
  }
}

// One temperature limit: conditions, temperature sweeps and thermal scans stop at the same value.
TEST(ParameterTable, OneTemperatureLimit) {
  EXPECT_EQ(quantity("conditions.temperature_K").maximum, kMaxTemperatureK);
  EXPECT_EQ(quantity("centre.zpl_anchor.temperature_K").maximum, kMaxTemperatureK);
  EXPECT_EQ(kMaxThermalTemperatureK, kMaxTemperatureK);
  const InputError e = parseError(projectText(
      R"("sweeps": [{"name": "t", "kind": "temperature", "from": 4, "to": 1200, "points": 10}])"));
  EXPECT_EQ(e.keyPath(), "p.json: sweeps[0].to");
  EXPECT_NE(e.message().find("0 \u2026 1000 K"), std::string::npos) << e.message();
}

// The planner grid step: the same range for a request file, the CLI option and the Python call.
TEST(ParameterTable, PlannerStepHasOneRange) {
  MagnetReach reach;
  reach.stepDeg = 0.01;  // would be an 18000 x 36000 grid
  try {
    (void)reachableDirections(reach);
    FAIL() << "a step below the table's minimum was accepted";
  } catch (const InputError& e) {
    EXPECT_EQ(e.keyPath(), "reach.step_deg");
    EXPECT_NE(e.message().find("0.05 \u2026 90 deg"), std::string::npos) << e.message();
  }
  reach.stepDeg = 30;
  EXPECT_FALSE(reachableDirections(reach).empty());
}

TEST(InputErrorParts, LocatedInKeepsTheMessageAndPrefixesTheKeyPath) {
  const InputError inner("field.magnitude_T", "value 2000 is outside the accepted range");
  const InputError outer = locatedIn(inner, "a.json");
  EXPECT_EQ(outer.keyPath(), "a.json: field.magnitude_T");
  EXPECT_EQ(outer.message(), inner.message());
  EXPECT_EQ(locatedIn(InputError("", "empty file"), "a.json").keyPath(), "a.json");
}

// The GUI asks for a unit exactly when this error type arrives (no test of the message text).
TEST(InputErrorParts, SpectrumWithoutUnitHasItsOwnType) {
  EXPECT_THROW(parseSpectrumCsv("1,2\n3,4\n", "s.csv"), SpectrumUnitMissingError);
  EXPECT_THROW(parseSpectrumCsv("x,signal\n1,2\n3,4\n", "s.csv"), SpectrumUnitMissingError);
  EXPECT_NO_THROW(parseSpectrumCsv("1,2\n3,4\n", "s.csv", SpectralUnit::GHzDetuning));
  try {
    parseSpectrumCsv("THz,signal\n400,1\nabc,2\n", "s.csv");
    FAIL() << "a bad number was accepted";
  } catch (const SpectrumUnitMissingError&) {
    FAIL() << "a file with a unit reported a missing unit";
  } catch (const InputError& e) {
    EXPECT_EQ(e.keyPath(), "s.csv:3");
  }
}

}  // namespace
}  // namespace finestra

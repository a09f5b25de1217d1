// A measured spectrum imported by the user is part of the project file, so that save and open
// never lose it; its errors name the key.
#include <gtest/gtest.h>

#include "core/common/errors.h"
#include "core/io/project_file.h"

using namespace finestra;

namespace {

std::string projectText(const std::string& spectrumJson) {
  return R"({ "format": "finestra-project", "version": 1,
              "centre": { "preset": "SiV-", "isotope": null, "parameters": {} },
              "measured_spectrum": )" +
         spectrumJson + " }";
}

std::string errorOf(const std::string& text) {
  try {
    parseProject(text, "p.json");
  } catch (const InputError& e) {
    return e.what();
  }
  return "no error";
}

}  // namespace

TEST(ProjectSpectrum, SurvivesSaveAndOpenExactly) {
  Project p = parseProject(projectText("null"), "p.json");
  EXPECT_FALSE(p.measuredSpectrum.has_value());
  MeasuredSpectrum m;
  m.name = "scan.csv";
  m.unit = SpectralUnit::NmAir;
  m.position = {736.5, 736.6000000000001, 736.7};
  m.signal = {0.1, 12.25, 1e-300};
  p.measuredSpectrum = m;
  const Project back = parseProject(projectToJson(p), "p.json");
  ASSERT_TRUE(back.measuredSpectrum.has_value());
  EXPECT_EQ(back.measuredSpectrum->name, "scan.csv");
  EXPECT_EQ(back.measuredSpectrum->unit, SpectralUnit::NmAir);
  EXPECT_EQ(back.measuredSpectrum->position, m.position);  // bit-exact: JSON round trip of doubles
  EXPECT_EQ(back.measuredSpectrum->signal, m.signal);
}

TEST(ProjectSpectrum, BadContentNamesTheKey) {
  EXPECT_NE(errorOf(projectText(R"({"unit": "THz", "position": [1, 2, 3], "signal": [1, 2]})"))
                .find("p.json: measured_spectrum.signal"),
            std::string::npos);
  EXPECT_NE(errorOf(projectText(R"({"unit": "furlong", "position": [1, 2], "signal": [1, 2]})"))
                .find("measured_spectrum.unit"),
            std::string::npos);
  EXPECT_NE(errorOf(projectText(R"({"unit": "THz", "position": [1, "x"], "signal": [1, 2]})"))
                .find("measured_spectrum.position[1]"),
            std::string::npos);
  EXPECT_NE(errorOf(projectText(R"({"unit": "THz", "position": [1], "signal": [1]})")).find("at least two"),
            std::string::npos);
  EXPECT_NE(errorOf(projectText(R"({"unit": "THz", "position": [1, 2], "signal": [1, 2], "colour": 3})"))
                .find("colour"),
            std::string::npos);
}

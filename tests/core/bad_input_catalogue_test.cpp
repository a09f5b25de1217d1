// The bad-input catalogue (tests/data/bad/catalogue.json): every file there must be rejected with
// an InputError whose message contains the catalogued text, naming the file (and line) for errors
// found while reading, or the key for errors found while building the model. Parameter values given
// through the API (not files) are catalogued in the second half of this file.
#include <gtest/gtest.h>

#include <filesystem>
#include <fstream>
#include <nlohmann/json.hpp>
#include <string>
#include <vector>

#include "core/common/errors.h"
#include "core/crystal/frames.h"
#include "core/common/text_escape.h"
#include "core/fit/fit_report.h"
#include "core/fit/least_squares.h"
#include "core/io/json_reader.h"
#include "core/io/peak_csv.h"
#include "core/io/spectrum_csv.h"
#include "core/io/project_file.h"
#include "core/io/text_file.h"
#include "core/project/model_setup.h"
#include "core/project/evaluate.h"
#include "core/optics/spectrum.h"
#include "core/report/table.h"
#include "core/units/spectral_units.h"

using namespace finestra;
namespace fs = std::filesystem;

namespace {

const fs::path kBadDir = fs::path(FINESTRA_TEST_DATA_DIR) / "bad";

struct CatalogueEntry {
  std::string file;  ///< empty for command-line entries
  std::string what;
  std::string stage;
  std::vector<std::string> expect;
};

std::vector<CatalogueEntry> loadCatalogue() {
  const nlohmann::json doc = parseJsonStrict(readTextFile((kBadDir / "catalogue.json").string()), "catalogue.json");
  std::vector<CatalogueEntry> out;
  for (const auto& e : doc.at("entries")) {
    CatalogueEntry entry;
    entry.file = e.value("file", "");
    entry.what = e.at("what").get<std::string>();
    entry.stage = e.at("stage").get<std::string>();
    for (const auto& s : e.at("expect")) entry.expect.push_back(s.get<std::string>());
    out.push_back(entry);
  }
  return out;
}

/// What a user of the core does with a project file: read it, build the model, solve every class.
/// Returns the message of the InputError thrown, or "" when everything succeeded.
std::string firstError(const std::string& path, std::string& stageSeen) {
  stageSeen = "read";
  try {
    const Project project = readProjectFile(path);
    stageSeen = "model";
    const CentreModel model(makeModelSetup(project));
    const auto classes = solveProjectClasses(model, project);
    stageSeen = "run";
    (void)classes;
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

}  // namespace

TEST(BadInputCatalogue, HasAtLeastThirtyEntriesEachWithAnExpectedMessage) {
  const auto entries = loadCatalogue();
  EXPECT_GE(entries.size(), 30u);
  for (const auto& e : entries) {
    EXPECT_FALSE(e.expect.empty()) << e.what;
    EXPECT_FALSE(e.what.empty());
  }
}

TEST(BadInputCatalogue, EveryFileIsCatalogued) {
  std::vector<std::string> catalogued;
  for (const auto& e : loadCatalogue())
    if (!e.file.empty()) catalogued.push_back(e.file);
  for (const auto& item : fs::directory_iterator(kBadDir)) {
    const std::string name = item.path().filename().string();
    if (name == "catalogue.json") continue;
    EXPECT_NE(std::find(catalogued.begin(), catalogued.end(), name), catalogued.end())
        << name << " is in tests/data/bad but not in catalogue.json";
  }
}

TEST(BadInputCatalogue, EveryFileIsRejectedWithItsMessage) {
  int checked = 0;
  for (const auto& entry : loadCatalogue()) {
    if (entry.file.empty() || entry.stage == "run") continue;
    SCOPED_TRACE(entry.file + " (" + entry.what + ")");
    std::string stage;
    const std::string message = firstError((kBadDir / entry.file).string(), stage);
    ASSERT_FALSE(message.empty()) << "accepted without an error";
    EXPECT_EQ(stage, entry.stage) << message;
    for (const auto& part : entry.expect) EXPECT_NE(message.find(part), std::string::npos) << "missing '" << part << "' in: " << message;
    if (entry.stage == "read") {
      EXPECT_NE(message.find(entry.file), std::string::npos) << "the message must name the file: " << message;
    }
    ++checked;
  }
  EXPECT_GE(checked, 30);
}

// ---- Parameter values given through the API -------------------------------------------------

namespace {
template <typename Call>
std::string messageOf(Call call) {
  try {
    call();
  } catch (const InputError& e) {
    return e.what();
  }
  return "";
}

Project goodProject() {
  Project p;
  p.centre.preset = "SiV-";
  p.field = FieldSetting::fromAngles(0.5, 54.7356, 0.0);
  return p;
}

void expectMessage(const std::string& message, std::initializer_list<const char*> parts) {
  ASSERT_FALSE(message.empty()) << "accepted without an error";
  for (const char* part : parts) EXPECT_NE(message.find(part), std::string::npos) << "missing '" << part << "' in: " << message;
}
}  // namespace

TEST(BadParameterValues, UnknownSpectralUnitNamesTheOption) {
  expectMessage(messageOf([] { parseSpectralUnit("Angstrom", "--unit"); }), {"--unit", "'Angstrom'", "nm_vac"});
}

TEST(BadParameterValues, NonFiniteAndNonPositivePositions) {
  expectMessage(messageOf([] { toAbsoluteGHz(std::nan(""), SpectralUnit::THz, 0); }), {"position", "not a finite number"});
  expectMessage(messageOf([] { toAbsoluteGHz(-1.0, SpectralUnit::NmAir, 0); }), {"position", "wavelength must be positive"});
  expectMessage(messageOf([] { toAbsoluteGHz(0.0, SpectralUnit::InvCm, 0); }), {"position", "wavenumber must be positive"});
}

TEST(BadParameterValues, SampleAxesZeroOrNotPerpendicular) {
  expectMessage(messageOf([] { LabFrame(Vec3(0, 0, 1), Vec3(0, 0, 0), "sample"); }), {"sample.in_plane_x", "zero"});
  expectMessage(messageOf([] { LabFrame(Vec3(0, 0, 1), Vec3(0, 1, 1), "sample"); }), {"sample", "not perpendicular", "45"});
  expectMessage(messageOf([] { LabFrame(Vec3(0, 0, std::nan("")), Vec3(1, 0, 0), "sample"); }), {"sample.normal", "non-finite"});
}

TEST(BadParameterValues, SpectrumRangeAndPointCount) {
  const Project p = goodProject();
  const CentreModel model(makeModelSetup(p));
  const auto classes = solveProjectClasses(model, p);
  const auto lines = weightLines(model, classes, SpectrumKind::Emission);
  expectMessage(messageOf([&] { computeSpectrum(model, lines, SpectralUnit::GHzDetuning, -10, 10, 1); }), {"points", "at least 2"});
  expectMessage(messageOf([&] { computeSpectrum(model, lines, SpectralUnit::GHzDetuning, 5, 5, 100); }), {"range"});
  expectMessage(messageOf([&] { computeSpectrum(model, lines, SpectralUnit::GHzDetuning, -INFINITY, 5, 100); }), {"range", "finite"});
  expectMessage(messageOf([&] { computeSpectrum(model, lines, SpectralUnit::NmVacuum, -5, 740, 100); }),
                {"range (from, to)", "wavelength must be positive", "nm_vac"});
}

TEST(BadParameterValues, ModelValuesSetInMemory) {
  Project p = goodProject();
  p.conditions.temperatureK = -1;
  expectMessage(messageOf([&] { CentreModel m(makeModelSetup(p)); }), {"conditions.temperature_K", "negative"});
  p = goodProject();
  p.centre.overrides["lifetime_ns"] = 0.0;
  expectMessage(messageOf([&] { CentreModel m(makeModelSetup(p)); }), {"lifetime_ns", "positive"});
  p = goodProject();
  p.centre.overrides["zpl_THz"] = -406.0;
  expectMessage(messageOf([&] { CentreModel m(makeModelSetup(p)); }), {"zpl_THz", "positive"});
  p = goodProject();
  p.strain.crystal(0, 1) = 1e-4;  // not symmetric
  expectMessage(messageOf([&] { CentreModel m(makeModelSetup(p)); }), {"strain.crystal", "symmetric"});
  p = goodProject();
  p.centre.overrides["no_such_key"] = 1.0;
  expectMessage(messageOf([&] { makeModelSetup(p); }), {"centre.parameters.no_such_key", "unknown parameter key"});
}

TEST(BadParameterValues, NonFiniteFieldIsRejectedBeforeSolving) {
  const Project p = goodProject();
  const CentreModel model(makeModelSetup(p));
  expectMessage(messageOf([&] { model.solve(0, Vec3(0, std::nan(""), 1)); }), {"field", "non-finite"});
  expectMessage(messageOf([&] { model.solve(4, Vec3(0, 0, 1)); }), {"classes", "0..3"});
}

TEST(BadParameterValues, SaveToAnImpossiblePlaceNamesThePath) {
  const fs::path dir = fs::temp_directory_path() / "finestra_catalogue_save";
  fs::create_directories(dir);
  const fs::path regularFile = dir / "a_file.txt";
  std::ofstream(regularFile) << "not a folder";
  const std::string target = (regularFile / "project.json").string();  // parent is a regular file
  expectMessage(messageOf([&] { writeFileAtomically(target, "{}"); }), {"a_file.txt/project.json", "cannot write"});
  const std::string missingFolder = (dir / "no" / "such" / "folder" / "p.json").string();
  expectMessage(messageOf([&] { writeFileAtomically(missingFolder, "{}"); }), {"no/such/folder/p.json", "cannot write"});
  fs::remove_all(dir);
}

// ---- Text encodings, control characters, measured values (second hardening pass) -------------

namespace {
const std::string kPeakHeader = "measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma\n";
}  // namespace

TEST(BadTextInput, PeakCsvWithByteOrderMarkAndWindowsLineEndsIsRead) {
  const std::string text = "\xEF\xBB\xBF" + std::string("measurement,field_T,polar_deg,azimuth_deg,position,unit,sigma\r\n") +
                           "a,0.5,0,0,406.7,THz,0.0001\r\n";
  const auto sets = parsePeakCsv(text, "bom.csv");
  ASSERT_EQ(sets.size(), 1u);
  EXPECT_EQ(sets[0].name, "a");
  EXPECT_EQ(sets[0].peaks.size(), 1u);
}

TEST(BadTextInput, Latin1PeakCsvIsRefusedNamingTheRowAndAskingForUtf8) {
  const std::string text = kPeakHeader + "a,0.5,0,0,406.7,THz,0.0001\n" + "mesure \xE9t\xE9,0.5,0,0,406.7,THz,0.0001\n";
  const std::string m = messageOf([&] { parsePeakCsv(text, "latin1.csv"); });
  expectMessage(m, {"latin1.csv:3", "save the file as UTF-8"});
  EXPECT_EQ(firstInvalidUtf8(m), std::string::npos) << "the message itself must be valid UTF-8";
}

TEST(BadTextInput, Latin1SpectrumCsvIsRefusedNamingTheRow) {
  expectMessage(messageOf([] { parseSpectrumCsv("THz,signal \xB5W\n406.7,1\n406.8,2\n", "latin1_spectrum.csv", std::nullopt); }),
                {"latin1_spectrum.csv:1", "save the file as UTF-8"});
}

TEST(BadTextInput, Utf16CsvIsRefusedAskingForUtf8) {
  expectMessage(messageOf([] { parsePeakCsv(std::string("\xFF\xFEm\0e\0", 6), "utf16.csv"); }), {"utf16.csv", "UTF-16", "save it as UTF-8"});
}

TEST(BadTextInput, ExtraCsvCellsAreRefusedNamingTheRow) {
  const std::string text = kPeakHeader + "a,0.5,0,0,406.7,THz,0.0001,17\n";
  expectMessage(messageOf([&] { parsePeakCsv(text, "extra.csv"); }), {"extra.csv:2", "8 cells", "7 columns"});
}

TEST(BadTextInput, OverlongMeasurementNameIsRefused) {
  const std::string text = kPeakHeader + std::string(100000, 'x') + ",0.5,0,0,406.7,THz,0.0001\n";
  expectMessage(messageOf([&] { parsePeakCsv(text, "long.csv"); }), {"long.csv:2", "name longer than 256 bytes"});
}

TEST(BadTextInput, ControlCharactersAreEscapedInEveryMessage) {
  const InputError e("key\x1b[31m", std::string("bell\x07, nul ") + '\0' + ", C1 \xC2\x9B, bad \xFF, mark \xEF\xBB\xBF, line\nbreak");
  const std::string m = e.what();
  EXPECT_EQ(m, "key\\e[31m: bell\\x07, nul \\x00, C1 \\u009B, bad \\xFF, mark \\uFEFF, line\nbreak");
  EXPECT_EQ(escapeControlCharacters(m), m) << "escaping twice changes nothing";
  EXPECT_EQ(escapeControlCharacters("caf\xC3\xA9 \xCE\xBB"), "caf\xC3\xA9 \xCE\xBB") << "printable UTF-8 is kept";
}

TEST(BadTextInput, HugeOrTinyPeakValuesAreRefusedAtRead) {
  expectMessage(messageOf([] { parsePeakCsv(kPeakHeader + "a,0.5,0,0,1e308,GHz,0.1\n", "huge.csv"); }),
                {"huge.csv:2", "position", "not an optical position"});
  expectMessage(messageOf([] { parsePeakCsv(kPeakHeader + "a,0.5,0,0,406.7,THz,1e-160\n", "tiny.csv"); }),
                {"tiny.csv:2: sigma", "below the smallest accepted"});
  expectMessage(messageOf([] { parsePeakCsv(kPeakHeader + "a,0.5,0,0,1e9,GHz_detuning,0.1\n", "far.csv"); }),
                {"far.csv:2", "too far from the ZPL"});
}

TEST(BadTextInput, OverflowingFitJacobianLeavesEveryParameterUndetermined) {
  Eigen::MatrixXd jac(4, 2);
  jac << 1, 2, 3, 4, 5, 6, std::numeric_limits<double>::infinity(), 1;
  const UncertaintyAnalysis a = analyseUncertainty(jac, 1e300, 1e-10);
  EXPECT_EQ(a.undetermined.size(), 2u);
  EXPECT_TRUE(std::isnan(a.standardErrors[0]));
}

TEST(BadTextInput, InputFileLargerThanTheLimitStopsWithAMessage) {
  expectMessage(messageOf([] { readTextFile("/dev/zero"); }), {"/dev/zero", "larger than the limit of 16 MiB"});
}

TEST(BadTextInput, FitWithoutDegreesOfFreedomReportsChiSquarePerDofAsUndefinedWithAReason) {
  FitResult r;
  r.dof = 0;
  r.chi2PerDof = std::numeric_limits<double>::quiet_NaN();
  const auto doc = fitJson(goodProject(), r);
  EXPECT_TRUE(doc.at("chi2_per_dof").is_null());
  EXPECT_NE(doc.at("chi2_per_dof_undefined_reason").get<std::string>().find("no degrees of freedom"), std::string::npos);
}

TEST(BadTextInput, StrainOfFivePercentIsTheStatedLimit) {
  Project p = goodProject();
  p.strain.crystal(2, 2) = 0.05;
  EXPECT_NO_THROW(CentreModel m(makeModelSetup(p)));
  p.strain.crystal(2, 2) = 0.5;
  expectMessage(messageOf([&] { CentreModel m(makeModelSetup(p)); }), {"strain.crystal", "0.05", "outside the model"});
}

TEST(BadTextInput, PeakCsvFieldBeyondWhatAProjectAcceptsIsRefusedAtImport) {
  // What the import accepts, the project reader must open again: both stop at 1000 T.
  expectMessage(messageOf([] { parsePeakCsv(kPeakHeader + "a,5000,0,0,406.7,THz,0.0001\n", "strong.csv"); }),
                {"strong.csv:2", "field_T", "0 … 1000 T"});
}

TEST(BadTextInput, UndefinedCellsKeepTableColumnsAligned) {
  const Table t{{"value", "next"}, {{"—", "x"}, {"12345", "y"}}};
  const std::string text = t.toText();
  // Every line has the "next" column at the same terminal column: "—" counts as one.
  EXPECT_NE(text.find("    —     x\n"), std::string::npos) << text;
  EXPECT_NE(text.find("12345     y\n"), std::string::npos) << text;
}

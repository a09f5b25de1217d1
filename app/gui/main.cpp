// finestra: the desktop application. Wiring only: command-line flags, then either a headless
// figure export or the main window.
#include <QApplication>
#include <QCommandLineParser>
#include <QTimer>
#include <algorithm>
#include <cstdio>
#include <spdlog/spdlog.h>

#include "core/common/errors.h"
#include "ui/headless.h"
#include "ui/main_window.h"
#include "ui/result_view.h"

namespace {

finestra::SpectralUnit unitOption(const QString& key) {
  return finestra::parseSpectralUnit(key.toStdString(), "--unit");
}

}  // namespace

int main(int argc, char** argv) {
  bool headless = false, windowless = false;  // windowless: help and version need no display either
  for (int i = 1; i < argc; ++i) {
    const QByteArray arg(argv[i]);
    if (arg == "--export-view") headless = true;
    if (arg == "--help" || arg == "-h" || arg == "--version" || arg == "-v") windowless = true;
  }
  if ((headless || windowless) && qEnvironmentVariableIsEmpty("QT_QPA_PLATFORM")) qputenv("QT_QPA_PLATFORM", "offscreen");
  QApplication app(argc, argv);
  Q_INIT_RESOURCE(finestra_ui);
  QApplication::setOrganizationName("Finestra");
  QApplication::setApplicationName("finestra");
  QApplication::setApplicationVersion("0.1.0");

  QCommandLineParser parser;
  parser.setApplicationDescription("Fine structure of group-IV vacancy centres in diamond: levels, lines, spectra.");
  parser.addHelpOption();
  parser.addVersionOption();
  parser.addPositionalArgument("project", "Project file to open.", "[project.json]");
  const QCommandLineOption projectOption("project", "Project file.", "file");
  QStringList viewKeys;
  for (const finestra::ui::ViewEntry& v : finestra::ui::viewCatalogue()) viewKeys << v.key;
  const QCommandLineOption viewOption("export-view", "Export one view without a window: " + viewKeys.join(", ") + ".", "view");
  const QCommandLineOption outOption("out", "Output file of --export-view or --screenshot (.png, .svg, .pdf, .csv).", "file");
  const QCommandLineOption unitOpt("unit", "Spectral axis: GHz_detuning, GHz, THz, nm_vac, nm_air, meV, cm-1.", "unit", "GHz_detuning");
  const QCommandLineOption sweepOption("sweep", "Index of the project sweep used for the plots.", "index", "0");
  const QCommandLineOption sizeOption("size", "Figure size WIDTHxHEIGHT in pixels.", "size", "1400x900");
  const QCommandLineOption peaksOption("import-peaks", "Measured peaks CSV to add.", "file");
  const QCommandLineOption spectrumOption("import-spectrum", "Measured spectrum CSV to overlay.", "file");
  const QCommandLineOption shotOption("screenshot", "Open the window, show this view, save a screenshot to --out, quit.", "view");
  const QCommandLineOption delayOption("screenshot-delay", "Milliseconds between the first result and the --screenshot grab.", "ms", "400");
  const QCommandLineOption recoveryOption("recovery-folder", "Folder for autosaved copies (testing).", "folder");
  const QCommandLineOption autosaveOption("autosave-interval", "Milliseconds between autosaves of unsaved edits.", "ms", "20000");
  parser.addOptions({projectOption, viewOption, outOption, unitOpt, sweepOption, sizeOption, peaksOption, spectrumOption,
                     shotOption, delayOption, recoveryOption, autosaveOption});
  parser.process(app);

  QString project = parser.value(projectOption);
  if (project.isEmpty() && !parser.positionalArguments().isEmpty()) project = parser.positionalArguments().front();
  finestra::ui::DisplaySettings display;
  const QStringList size = parser.value(sizeOption).split('x');
  const int width = size.size() == 2 ? size[0].toInt() : 1400, height = size.size() == 2 ? size[1].toInt() : 900;
  try {
    display.unit = unitOption(parser.value(unitOpt));
    display.sweepIndex = parser.value(sweepOption).toInt();
    if (headless) {
      if (project.isEmpty() || parser.value(outOption).isEmpty())
        throw finestra::InputError("--export-view", "needs --project FILE and --out FILE");
      finestra::ui::runHeadlessExport({project, parser.value(viewOption), parser.value(outOption), width, height, display,
                                       parser.value(peaksOption), parser.value(spectrumOption)});
      return 0;
    }
  } catch (const finestra::InputError& e) {
    std::fprintf(stderr, "finestra: %s\n", e.what());
    return 2;
  }

  finestra::ui::MainWindow window(parser.value(recoveryOption), std::clamp(parser.value(autosaveOption).toInt(), 100, 3600000));
  window.show();
  if (!project.isEmpty()) window.openProject(project);
  if (parser.isSet(peaksOption)) window.importPeaks(parser.value(peaksOption));
  if (parser.isSet(spectrumOption)) window.importSpectrum(parser.value(spectrumOption));
  if (parser.isSet(shotOption)) {
    // Screenshot mode: wait for the first result after loading, show the view, grab the window.
    const QString view = parser.value(shotOption), out = parser.value(outOption);
    window.resize(width, height);
    if (!window.showView(view)) {
      std::fprintf(stderr, "finestra: --screenshot: unknown view '%s'\n", qPrintable(view));
      return 2;
    }
    const int delayMs = std::max(0, parser.value(delayOption).toInt());
    QObject::connect(&window, &finestra::ui::MainWindow::resultShown, &window, [&window, out, delayMs] {
      QTimer::singleShot(delayMs, &window, [&window, out] {
        if (!window.grab().save(out)) std::fprintf(stderr, "finestra: cannot write %s\n", qPrintable(out));
        window.document().undoStack().setClean();
        window.close();
      });
    });
  } else {
    QTimer::singleShot(0, &window, [&window] { window.offerRecovery(); });
  }
  return app.exec();
}

// Desktop habits of the main window: a wheel over an input box that does not have the focus
// scrolls the setup panel and changes nothing; wheel and key edits in one focused box are one undo
// step; the undo key means the document's undo even inside a spin box; window geometry, dock
// layout and last tab come back in the next session; recent files are bounded; shortcuts are set;
// exports get the extension of the chosen type; the recovery question names its actions; no Qt
// warning on start. Settings go to a temporary folder, never to the user's.
#include <QAction>
#include <QComboBox>
#include <QDockWidget>
#include <QDoubleSpinBox>
#include <QFile>
#include <QMenuBar>
#include <QPushButton>
#include <QScrollBar>
#include <QSettings>
#include <QSignalSpy>
#include <QStandardPaths>
#include <QTabWidget>
#include <QTemporaryDir>
#include <QTimer>
#include <QTest>
#include <gtest/gtest.h>
#include <map>
#include <set>

#include "core/io/project_file.h"
#include "ui/file_names.h"
#include "ui/input_intent.h"
#include "ui/main_window.h"
#include "ui/recovery_question.h"
#include "ui/setup/setup_panel.h"

// The window icon lives in the ui library's resources; the application loads them in main().
static void loadUiResources() { Q_INIT_RESOURCE(finestra_ui); }

namespace finestra::ui {
namespace {

const QString kExample = QStringLiteral(FINESTRA_SOURCE_DIR "/examples/membrane-vector-magnet.json");

class DesktopHabits : public ::testing::Test {
protected:
  void SetUp() override {
    ASSERT_TRUE(settingsDir_.isValid());
    QSettings::setPath(QSettings::NativeFormat, QSettings::UserScope, settingsDir_.path());
    QSettings::setPath(QSettings::IniFormat, QSettings::UserScope, settingsDir_.path());
  }
  void TearDown() override {
    const QString standard = QStandardPaths::writableLocation(QStandardPaths::GenericConfigLocation);
    QSettings::setPath(QSettings::NativeFormat, QSettings::UserScope, standard);
    QSettings::setPath(QSettings::IniFormat, QSettings::UserScope, standard);
  }
  std::unique_ptr<MainWindow> makeWindow() {
    auto window = std::make_unique<MainWindow>(recoveryDir_.path(), 3600000);
    window->resize(1000, 640);
    window->show();
    EXPECT_TRUE(QTest::qWaitForWindowExposed(window.get()));
    return window;
  }
  static void focus(MainWindow& window, QWidget& widget) {
    QApplication::setActiveWindow(&window);
    ASSERT_TRUE(QTest::qWaitForWindowActive(&window));
    widget.setFocus(Qt::OtherFocusReason);
    ASSERT_TRUE(QTest::qWaitFor([&] { return widget.hasFocus(); }));
  }
  static void turnWheel(QWidget& target, int notches) {
    const QPointF at = target.rect().center();
    for (int i = 0; i < std::abs(notches); ++i) {
      QWheelEvent wheel(at, target.mapToGlobal(at), QPoint(), QPoint(0, notches > 0 ? 120 : -120), Qt::NoButton,
                        Qt::NoModifier, Qt::NoScrollPhase, false);
      QApplication::sendEvent(&target, &wheel);
    }
  }

  QTemporaryDir settingsDir_, recoveryDir_;
};

TEST_F(DesktopHabits, WheelOverUnfocusedInputsScrollsThePanelAndChangesNothing) {
  auto window = makeWindow();
  ASSERT_TRUE(window->openProject(kExample));
  auto* panel = window->findChild<SetupPanel*>();
  ASSERT_NE(panel, nullptr);
  ASSERT_GT(panel->verticalScrollBar()->maximum(), 0) << "the panel must be taller than its dock for this test";
  panel->verticalScrollBar()->setValue(0);
  focus(*window, *window->view("levels"));
  const std::string before = projectToJson(window->document().project());
  const int steps = window->document().undoStack().count();

  auto* strain = panel->findChild<QDoubleSpinBox*>(QStringLiteral("strain.crystal.yy"));
  ASSERT_NE(strain, nullptr);
  const double shown = strain->value();
  turnWheel(*strain, -6);  // six notches down, as a user scrolling the panel would
  EXPECT_EQ(strain->value(), shown);
  EXPECT_GT(panel->verticalScrollBar()->value(), 0) << "the wheel should scroll the panel";

  int inputs = 0;
  for (QWidget* input : panel->findChildren<QWidget*>()) {
    if (!InputIntentGuard::isValueInput(input) || !input->isVisible()) continue;
    EXPECT_FALSE(input->hasFocus());
    EXPECT_EQ(input->focusPolicy(), Qt::StrongFocus) << input->metaObject()->className();
    turnWheel(*input, 3);
    turnWheel(*input, -2);
    ++inputs;
  }
  EXPECT_GT(inputs, 15);
  EXPECT_EQ(projectToJson(window->document().project()), before);
  EXPECT_EQ(window->document().undoStack().count(), steps);
}

TEST_F(DesktopHabits, EditsInOneFocusedBoxAreOneUndoStepAndUndoKeyUndoesIt) {
  auto window = makeWindow();
  ASSERT_TRUE(window->openProject(kExample));
  ProjectDocument& doc = window->document();
  auto* strain = window->findChild<QDoubleSpinBox*>(QStringLiteral("strain.crystal.yy"));
  ASSERT_NE(strain, nullptr);
  const double start = doc.project().strain.crystal(1, 1);
  const double step = strain->singleStep() * 1e-6;  // the box shows units of 1e-6
  focus(*window, *strain);

  turnWheel(*strain, 2);
  QTest::keyClick(strain, Qt::Key_Up);
  EXPECT_NEAR(doc.project().strain.crystal(1, 1), start + 3 * step, 1e-15);
  EXPECT_EQ(doc.undoStack().count(), 1) << "two wheel notches and a key press in one focus are one step";

  // Ctrl+Z inside the spin box is the document's undo, not the box's text undo.
  QTest::keyClick(strain, Qt::Key_Z, Qt::ControlModifier);
  EXPECT_DOUBLE_EQ(doc.project().strain.crystal(1, 1), start);
  EXPECT_EQ(doc.undoStack().index(), 0);
  QTest::keyClick(strain, Qt::Key_Z, Qt::ControlModifier | Qt::ShiftModifier);
  EXPECT_NEAR(doc.project().strain.crystal(1, 1), start + 3 * step, 1e-15);

  // A new focus is a new step; up and back down in one focus leaves no step at all.
  auto* other = window->findChild<QDoubleSpinBox*>(QStringLiteral("strain.crystal.xx"));
  ASSERT_NE(other, nullptr);
  focus(*window, *other);
  focus(*window, *strain);
  turnWheel(*strain, 1);
  EXPECT_EQ(doc.undoStack().count(), 2);
  focus(*window, *other);
  turnWheel(*other, 2);
  turnWheel(*other, -2);
  EXPECT_EQ(doc.undoStack().count(), 2) << "an edit returned to its start is no step";
}

TEST_F(DesktopHabits, GeometryDockLayoutAndTabComeBack) {
  QSize size;
  {
    auto window = makeWindow();
    auto* log = window->findChild<QDockWidget*>(QStringLiteral("log"));
    ASSERT_NE(log, nullptr);
    window->addDockWidget(Qt::RightDockWidgetArea, log);
    window->resize(900, 560);  // clamped to the minimum size the docks need
    QTest::qWait(20);
    size = window->size();
    ASSERT_TRUE(window->showView(QStringLiteral("spectrum")));
    EXPECT_TRUE(window->close());
  }
  auto restored = std::make_unique<MainWindow>(recoveryDir_.path(), 3600000);
  restored->show();
  ASSERT_TRUE(QTest::qWaitForWindowExposed(restored.get()));
  EXPECT_EQ(restored->size(), size);
  auto* log = restored->findChild<QDockWidget*>(QStringLiteral("log"));
  ASSERT_NE(log, nullptr);
  EXPECT_EQ(restored->dockWidgetArea(log), Qt::RightDockWidgetArea);
  auto* tabs = restored->findChild<QTabWidget*>();
  ASSERT_NE(tabs, nullptr);
  EXPECT_EQ(tabs->currentWidget(), restored->view(QStringLiteral("spectrum")));
}

TEST_F(DesktopHabits, RecentFilesKeepTheEightNewest) {
  QTemporaryDir dir;
  auto window = makeWindow();
  for (int i = 0; i < 10; ++i) {
    const QString path = dir.filePath(QStringLiteral("project-%1.json").arg(i));
    ASSERT_TRUE(QFile::copy(kExample, path));
    ASSERT_TRUE(window->openProject(path));
  }
  auto* recent = window->findChild<QMenu*>(QStringLiteral("recent-files"));
  ASSERT_NE(recent, nullptr);
  const auto actions = recent->actions();
  ASSERT_EQ(actions.size(), MainWindow::kMaxRecent);
  EXPECT_TRUE(actions.front()->text().endsWith(QStringLiteral("project-9.json")));
  EXPECT_TRUE(actions.back()->text().endsWith(QStringLiteral("project-2.json")));
}

TEST_F(DesktopHabits, FrequentActionsHaveDistinctShortcuts) {
  auto window = makeWindow();
  std::map<QString, QKeySequence> shortcutOf;
  std::set<QString> seen;
  for (QMenu* menu : window->menuBar()->findChildren<QMenu*>())
    for (QAction* action : menu->actions()) {
      if (action->isSeparator() || action->menu()) continue;
      QString name = action->text();
      name.remove('&');
      for (const QKeySequence& key : action->shortcuts()) {
        EXPECT_TRUE(seen.insert(key.toString()).second) << "shortcut used twice: " << key.toString().toStdString();
      }
      if (!action->shortcut().isEmpty()) shortcutOf[name] = action->shortcut();
    }
  auto keyOf = [&](const QString& prefix) {
    for (const auto& [name, key] : shortcutOf)
      if (name.startsWith(prefix)) return key;
    return QKeySequence();
  };
  EXPECT_EQ(keyOf(QStringLiteral("Save as")), QKeySequence(Qt::CTRL | Qt::SHIFT | Qt::Key_S));
  EXPECT_EQ(keyOf(QStringLiteral("Undo")), QKeySequence(Qt::CTRL | Qt::Key_Z));
  for (const char* frequent : {"New project", "Open", "Save", "Import measured peaks", "Import measured spectrum",
                               "Export figure", "Export data", "Quit", "Redo", "Preferences", "Cancel computation",
                               "Level fans", "Spectrum"})
    EXPECT_FALSE(keyOf(QString::fromUtf8(frequent)).isEmpty()) << frequent;
}

TEST(FileNames, TypedNameWithoutExtensionGetsTheChosenType) {
  const QString figures = QStringLiteral("PNG (*.png);;SVG (*.svg);;PDF (*.pdf)");
  EXPECT_EQ(filterExtensions(figures), (QStringList{"png", "svg", "pdf"}));
  EXPECT_EQ(withOfferedExtension("/tmp/fans", "SVG (*.svg)", figures), QStringLiteral("/tmp/fans.svg"));
  EXPECT_EQ(withOfferedExtension("/tmp/fans", "", figures), QStringLiteral("/tmp/fans.png"));
  EXPECT_EQ(withOfferedExtension("/tmp/fans.PDF", "PNG (*.png)", figures), QStringLiteral("/tmp/fans.PDF"));
  EXPECT_EQ(withOfferedExtension("/tmp/run.v2", "PNG (*.png)", figures), QStringLiteral("/tmp/run.v2.png"));
  EXPECT_EQ(withOfferedExtension("/tmp/lines", "CSV (*.csv)", "CSV (*.csv)"), QStringLiteral("/tmp/lines.csv"));
  EXPECT_EQ(withOfferedExtension("", "CSV (*.csv)", "CSV (*.csv)"), QString());
}

TEST(RecoveryQuestion, ButtonsAreVerbsAndEachIsExplained) {
  QTemporaryDir dir;
  const QString original = dir.filePath(QStringLiteral("run.json"));
  ASSERT_TRUE(QFile::copy(kExample, original));
  const RecoveryEntry entry{dir.filePath(QStringLiteral("copy.json")), original, QStringLiteral("s1")};
  const auto box = makeRecoveryQuestion(entry, nullptr);
  QStringList verbs;
  for (QAbstractButton* b : box->buttons()) verbs << b->text();
  verbs.sort();
  EXPECT_EQ(verbs, (QStringList{"Decide later", "Discard copy", "Open original", "Recover"}));
  for (const QString& verb : verbs) EXPECT_TRUE(box->informativeText().contains(verb + ':')) << verb.toStdString();
  const std::map<QString, RecoveryChoice> expected{{"Recover", RecoveryChoice::Recover},
                                                    {"Discard copy", RecoveryChoice::DiscardCopy},
                                                    {"Open original", RecoveryChoice::OpenOriginal},
                                                    {"Decide later", RecoveryChoice::Later}};
  for (QAbstractButton* b : box->buttons()) {
    const auto clicked = makeRecoveryQuestion(entry, nullptr);
    for (QAbstractButton* same : clicked->buttons())
      if (same->text() == b->text()) QTimer::singleShot(0, same, &QAbstractButton::click);
    clicked->exec();
    EXPECT_EQ(recoveryChoiceOf(*clicked), expected.at(b->text())) << b->text().toStdString();
  }
  const auto untitled = makeRecoveryQuestion(RecoveryEntry{entry.projectPath, {}, "s2"}, nullptr);
  for (QAbstractButton* b : untitled->buttons()) EXPECT_NE(b->text(), QStringLiteral("Open original"));
}

QStringList capturedWarnings;
void captureWarnings(QtMsgType type, const QMessageLogContext&, const QString& message) {
  if (type == QtDebugMsg || type == QtInfoMsg) return;
  // The offscreen test platform itself says this for every window with size limits; under a real
  // display (xcb) the application prints nothing.
  if (QGuiApplication::platformName() == QStringLiteral("offscreen") &&
      message == QStringLiteral("This plugin does not support propagateSizeHints()"))
    return;
  capturedWarnings << message;
}

TEST_F(DesktopHabits, NoQtWarningOnStartOrOnTheFirstEdit) {
  loadUiResources();
  capturedWarnings.clear();
  const QtMessageHandler previous = qInstallMessageHandler(captureWarnings);
  {
    auto window = makeWindow();
    QSignalSpy shown(window.get(), &MainWindow::resultShown);
    window->openProject(kExample);
    EXPECT_TRUE(shown.count() > 0 || shown.wait(20000));
    window->document().edit("temperature", [](Project& p) { p.conditions.temperatureK = 7; });
    EXPECT_TRUE(window->isWindowModified());
    EXPECT_TRUE(window->windowTitle().contains(QStringLiteral("[*]")));
    QTest::qWait(50);
  }
  qInstallMessageHandler(previous);
  EXPECT_TRUE(capturedWarnings.isEmpty()) << capturedWarnings.join('\n').toStdString();
}

}  // namespace
}  // namespace finestra::ui

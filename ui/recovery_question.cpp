#include "ui/recovery_question.h"

#include <QAbstractButton>
#include <QFileInfo>
#include <QPushButton>

namespace finestra::ui {
namespace {
const char* const kChoiceProperty = "finestraRecoveryChoice";

QPushButton* addChoice(QMessageBox& box, const QString& verb, QMessageBox::ButtonRole role, RecoveryChoice choice) {
  QPushButton* button = box.addButton(verb, role);
  button->setProperty(kChoiceProperty, static_cast<int>(choice));
  return button;
}
}  // namespace

std::unique_ptr<QMessageBox> makeRecoveryQuestion(const RecoveryEntry& entry, QWidget* parent) {
  const bool hasOriginal = !entry.originalPath.isEmpty() && QFileInfo::exists(entry.originalPath);
  auto box = std::make_unique<QMessageBox>(parent);
  box->setIcon(QMessageBox::Question);
  box->setWindowTitle(QMessageBox::tr("Recover unsaved work"));
  box->setText(QMessageBox::tr("Finestra found unsaved work from a session that ended unexpectedly (%1).")
                   .arg(entry.originalPath.isEmpty() ? QMessageBox::tr("untitled project") : entry.originalPath));
  QString explained = QMessageBox::tr("Recover: open the unsaved work; save it to keep it.\n"
                                      "Discard copy: delete the unsaved work for good.\n");
  if (hasOriginal) explained += QMessageBox::tr("Open original: open the file as last saved; the unsaved work is kept and offered again.\n");
  explained += QMessageBox::tr("Decide later: open nothing now; the unsaved work is offered again at the next start.");
  box->setInformativeText(explained);
  QPushButton* recover = addChoice(*box, QMessageBox::tr("Recover"), QMessageBox::AcceptRole, RecoveryChoice::Recover);
  addChoice(*box, QMessageBox::tr("Discard copy"), QMessageBox::DestructiveRole, RecoveryChoice::DiscardCopy);
  if (hasOriginal) addChoice(*box, QMessageBox::tr("Open original"), QMessageBox::ActionRole, RecoveryChoice::OpenOriginal);
  addChoice(*box, QMessageBox::tr("Decide later"), QMessageBox::RejectRole, RecoveryChoice::Later);
  box->setDefaultButton(recover);
  return box;
}

RecoveryChoice recoveryChoiceOf(const QMessageBox& box) {
  const QAbstractButton* clicked = box.clickedButton();
  if (!clicked || !clicked->property(kChoiceProperty).isValid()) return RecoveryChoice::Later;
  return static_cast<RecoveryChoice>(clicked->property(kChoiceProperty).toInt());
}

RecoveryChoice askAboutRecovery(const RecoveryEntry& entry, QWidget* parent) {
  const std::unique_ptr<QMessageBox> box = makeRecoveryQuestion(entry, parent);
  box->exec();
  return recoveryChoiceOf(*box);
}

}  // namespace finestra::ui

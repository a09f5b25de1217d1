#pragma once
// The question asked at start-up for each copy of unsaved work left by a session that ended
// unexpectedly. Every button is a verb saying what it does.
#include <QMessageBox>
#include <memory>

#include "ui/autosave.h"

namespace finestra::ui {

enum class RecoveryChoice {
  Recover,       ///< open the unsaved copy (as modified) and delete the copy
  DiscardCopy,   ///< delete the copy; nothing is opened
  OpenOriginal,  ///< open the last saved file; the copy stays and is offered again next time
  Later,         ///< do nothing now; the copy is offered again next time
};

/// The dialog, not yet shown: buttons "Recover", "Discard copy", "Open original" (only when the
/// original file exists) and "Decide later" (also Esc).
std::unique_ptr<QMessageBox> makeRecoveryQuestion(const RecoveryEntry& entry, QWidget* parent);
/// The choice made in a finished dialog.
RecoveryChoice recoveryChoiceOf(const QMessageBox& box);
/// Shows the dialog and waits for the choice.
RecoveryChoice askAboutRecovery(const RecoveryEntry& entry, QWidget* parent);

}  // namespace finestra::ui

#pragma once
// The document: the one place a project is edited. Every edit is a QUndoCommand holding the
// project before and after (projects are small plain data), so undo/redo is exact. Edits made
// during a slider drag, or by wheel and key presses in one focused input box, share a merge token
// and collapse into one undo step. Listeners get one
// changed(Changes) signal saying which parts moved; the document finds them itself by comparing the
// parts of the project before and after the edit (no serialisation, no flags from the caller).
#include <QObject>
#include <QString>
#include <QUndoStack>
#include <QVector>
#include <functional>
#include <optional>

#include "core/project/project.h"
#include "core/io/spectrum_csv.h"

namespace finestra::ui {

enum class Change : unsigned {
  Centre = 1u << 0,
  Sample = 1u << 1,
  Field = 1u << 2,
  Strain = 1u << 3,
  Conditions = 1u << 4,
  Classes = 1u << 5,
  Sweeps = 1u << 6,
  Measurements = 1u << 7,
  MeasuredSpectrum = 1u << 8,
  File = 1u << 9,  ///< path or modified state
  Fit = 1u << 10,  ///< fit settings (fit.free, fit.starts) or the session's fit labels
  Magnet = 1u << 11,       ///< the magnet calibration (true field from a magnet setting)
  Description = 1u << 12,  ///< the project's free text
  Everything = 0x1FFFu,
};
Q_DECLARE_FLAGS(Changes, Change)
Q_DECLARE_OPERATORS_FOR_FLAGS(Changes)

/// Changes that alter computed results (everything except file state and measured overlays).
inline constexpr Changes kPhysicsChanges = Changes(Change::Centre) | Change::Sample | Change::Field | Change::Strain |
                                           Change::Conditions | Change::Classes | Change::Sweeps | Change::Magnet;

/// The parts that differ between two projects (each part compared with its operator==).
Changes changesBetween(const Project& before, const Project& after);

/// The line a measured peak was matched to by the last fit or assignment of this session.
struct PeakLabel {
  int measurement = 0, peak = 0;  ///< indices into project.measurements and its peaks
  QString text;                   ///< e.g. "C1·cl0"
};

class ProjectDocument : public QObject {
  Q_OBJECT
public:
  explicit ProjectDocument(QObject* parent = nullptr);

  const Project& project() const { return project_; }
  QUndoStack& undoStack() { return undoStack_; }
  QString filePath() const { return filePath_; }
  bool isModified() const { return !undoStack_.isClean() || modifiedOutsideUndo_; }
  /// Incremented on every state change (edits, undo, redo, load): lets autosave skip idle time.
  quint64 revision() const { return revision_; }

  /// Applies `mutate` to a copy of the project and pushes it as one undo step named `text`; the
  /// listeners learn which parts changed. An edit that changes no part pushes nothing. With a
  /// non-empty `mergeKey`, consecutive edits of the same key inside one drag (beginDrag/endDrag)
  /// merge into one step. Inside an input session (beginInputEdit/endInputEdit) every edit merges
  /// with the previous edit of the same session and the same key (mergeKey, or else `text`); a
  /// merged step that returns the project to where it started is dropped.
  void edit(const QString& text, const std::function<void(Project&)>& mutate, const QString& mergeKey = {});
  void beginDrag();
  void endDrag();
  quint64 dragToken() const { return dragToken_; }
  /// Marks the edits made while one event is delivered to a focused input box: `session` names
  /// the box and its current focus (a new number each time the box gains focus), so all edits of
  /// one box during one focus become one undo step. Nests with nothing: a second begin replaces.
  void beginInputEdit(quint64 session);
  void endInputEdit();

  /// Replaces the document (new/open/recover): clears undo history. `modified` marks a recovered
  /// project as unsaved.
  void reset(Project project, const QString& filePath, bool modified = false);
  /// Throws InputError naming the file and key; the current document is untouched on error.
  void open(const QString& path);
  /// Atomic write; throws InputError naming the path; on success the document becomes clean.
  void saveAs(const QString& path);

  /// The measured spectrum is part of the project (saved with it); setting or removing it is one
  /// undo step.
  const std::optional<MeasuredSpectrum>& measuredSpectrum() const { return project_.measuredSpectrum; }
  void setMeasuredSpectrum(std::optional<MeasuredSpectrum> spectrum);

  /// Labels from the last fit or assignment run in this session: neither saved nor undoable, and
  /// dropped by any change of the measurements (their indices would no longer match).
  const QVector<PeakLabel>& fitLabels() const { return fitLabels_; }
  /// Emits changed(Change::Fit).
  void setFitLabels(QVector<PeakLabel> labels);

  /// Used by the undo commands only.
  void applyState(const Project& project, Changes what);

Q_SIGNALS:
  void changed(finestra::ui::Changes what);

private:
  Project project_;
  QUndoStack undoStack_;
  QString filePath_;
  bool modifiedOutsideUndo_ = false;
  quint64 revision_ = 0;
  quint64 dragToken_ = 0;
  quint64 nextDragToken_ = 1;
  quint64 inputSession_ = 0;
  QVector<PeakLabel> fitLabels_;
};

}  // namespace finestra::ui

Q_DECLARE_METATYPE(finestra::ui::Changes)

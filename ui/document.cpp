#include "ui/document.h"

#include <QHash>
#include <QUndoCommand>

#include "core/io/project_file.h"
#include "core/project/model_setup.h"

namespace finestra::ui {
namespace {

class ProjectEditCommand : public QUndoCommand {
public:
  ProjectEditCommand(ProjectDocument& document, const QString& text, Changes what, Project before, Project after,
                     int mergeId, quint64 mergeToken)
      : QUndoCommand(text), document_(document), what_(what), before_(std::move(before)),
        after_(std::move(after)), mergeId_(mergeId), mergeToken_(mergeToken) {}

  void undo() override { document_.applyState(before_, what_); }
  void redo() override { document_.applyState(after_, what_); }
  int id() const override { return mergeId_; }
  bool mergeWith(const QUndoCommand* other) override {
    const auto* next = dynamic_cast<const ProjectEditCommand*>(other);
    if (!next || next->mergeId_ != mergeId_ || mergeToken_ == 0 || next->mergeToken_ != mergeToken_) return false;
    after_ = next->after_;
    what_ |= next->what_;
    // Up then down in one box: nothing changed, so the stack drops the step.
    setObsolete(!changesBetween(before_, after_));
    return true;
  }

private:
  ProjectDocument& document_;
  Changes what_;
  Project before_, after_;
  int mergeId_;
  quint64 mergeToken_;  ///< 0: never merges
};

}  // namespace

Changes changesBetween(const Project& before, const Project& after) {
  Changes what;
  if (!(before.centre == after.centre)) what |= Change::Centre;
  if (!(before.sample == after.sample)) what |= Change::Sample;
  if (!(before.field == after.field)) what |= Change::Field;
  if (!(before.magnet == after.magnet)) what |= Change::Magnet;
  if (!(before.strain == after.strain)) what |= Change::Strain;
  if (!(before.conditions == after.conditions)) what |= Change::Conditions;
  if (before.classes != after.classes) what |= Change::Classes;
  if (before.sweeps != after.sweeps) what |= Change::Sweeps;
  if (before.measurements != after.measurements) what |= Change::Measurements;
  if (!(before.fit == after.fit)) what |= Change::Fit;
  if (before.measuredSpectrum != after.measuredSpectrum) what |= Change::MeasuredSpectrum;
  if (before.description != after.description) what |= Change::Description;
  return what;
}

ProjectDocument::ProjectDocument(QObject* parent) : QObject(parent) {
  qRegisterMetaType<Changes>("finestra::ui::Changes");
  connect(&undoStack_, &QUndoStack::cleanChanged, this, [this] { Q_EMIT changed(Change::File); });
}

void ProjectDocument::edit(const QString& text, const std::function<void(Project&)>& mutate, const QString& mergeKey) {
  Project after = project_;
  mutate(after);
  const Changes what = changesBetween(project_, after);
  if (!what) return;
  // A merge token of 0 means "never merge". Drag tokens are odd and input sessions even, so the
  // two kinds never merge with each other.
  quint64 token = 0;
  QString key = mergeKey;
  if (dragToken_ != 0 && !mergeKey.isEmpty()) {
    token = dragToken_ * 2 + 1;
  } else if (inputSession_ != 0) {
    token = inputSession_ * 2;
    if (key.isEmpty()) key = text;
  }
  // QUndoCommand ids must be non-negative to merge; -1 means "never merge".
  const int mergeId = token == 0 ? -1 : static_cast<int>(qHash(key) & 0x7fffffffu);
  undoStack_.push(new ProjectEditCommand(*this, text, what, project_, std::move(after), mergeId, token));
}

void ProjectDocument::beginDrag() { dragToken_ = nextDragToken_++; }
void ProjectDocument::endDrag() { dragToken_ = 0; }
void ProjectDocument::beginInputEdit(quint64 session) { inputSession_ = session; }
void ProjectDocument::endInputEdit() { inputSession_ = 0; }

void ProjectDocument::applyState(const Project& project, Changes what) {
  project_ = project;
  if (what & Change::Measurements) fitLabels_.clear();
  ++revision_;
  Q_EMIT changed(what);
}

void ProjectDocument::reset(Project project, const QString& filePath, bool modified) {
  undoStack_.clear();
  undoStack_.setClean();
  project_ = std::move(project);
  filePath_ = filePath;
  modifiedOutsideUndo_ = modified;
  fitLabels_.clear();
  ++revision_;
  Q_EMIT changed(Change::Everything);
}

void ProjectDocument::open(const QString& path) {
  Project loaded = readProjectFile(path.toStdString());
  makeModelSetup(loaded);  // reject files whose centre or sample cannot be resolved, before replacing
  reset(std::move(loaded), path);
}

void ProjectDocument::saveAs(const QString& path) {
  writeProjectFile(project_, path.toStdString());
  filePath_ = path;
  modifiedOutsideUndo_ = false;
  undoStack_.setClean();
  Q_EMIT changed(Change::File);
}

void ProjectDocument::setMeasuredSpectrum(std::optional<MeasuredSpectrum> spectrum) {
  const QString text = spectrum ? tr("Import measured spectrum") : tr("Remove measured spectrum");
  edit(text, [&](Project& p) { p.measuredSpectrum = std::move(spectrum); });
}

void ProjectDocument::setFitLabels(QVector<PeakLabel> labels) {
  fitLabels_ = std::move(labels);
  Q_EMIT changed(Change::Fit);
}

}  // namespace finestra::ui

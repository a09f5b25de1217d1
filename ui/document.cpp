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
                     int mergeId, quint64 dragToken)
      : QUndoCommand(text), document_(document), what_(what), before_(std::move(before)),
        after_(std::move(after)), mergeId_(mergeId), dragToken_(dragToken) {}

  void undo() override { document_.applyState(before_, what_); }
  void redo() override { document_.applyState(after_, what_); }
  int id() const override { return mergeId_; }
  bool mergeWith(const QUndoCommand* other) override {
    const auto* next = dynamic_cast<const ProjectEditCommand*>(other);
    if (!next || next->mergeId_ != mergeId_ || dragToken_ == 0 || next->dragToken_ != dragToken_) return false;
    after_ = next->after_;
    what_ |= next->what_;
    return true;
  }

private:
  ProjectDocument& document_;
  Changes what_;
  Project before_, after_;
  int mergeId_;
  quint64 dragToken_;
};

}  // namespace

ProjectDocument::ProjectDocument(QObject* parent) : QObject(parent) {
  qRegisterMetaType<Changes>("finestra::ui::Changes");
  connect(&undoStack_, &QUndoStack::cleanChanged, this, [this] { Q_EMIT changed(Change::File); });
}

void ProjectDocument::edit(const QString& text, Changes what, const std::function<void(Project&)>& mutate,
                           const QString& mergeKey) {
  Project after = project_;
  mutate(after);
  if (projectToJson(after) == projectToJson(project_)) return;
  // QUndoCommand ids must be non-negative to merge; -1 means "never merge".
  const int mergeId = mergeKey.isEmpty() ? -1 : static_cast<int>(qHash(mergeKey) & 0x7fffffffu);
  undoStack_.push(new ProjectEditCommand(*this, text, what, project_, std::move(after), mergeId,
                                         mergeKey.isEmpty() ? 0 : dragToken_));
}

void ProjectDocument::beginDrag() { dragToken_ = nextDragToken_++; }
void ProjectDocument::endDrag() { dragToken_ = 0; }

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
  edit(text, Change::MeasuredSpectrum, [&](Project& p) { p.measuredSpectrum = std::move(spectrum); });
}

void ProjectDocument::setFitLabels(QVector<PeakLabel> labels) {
  fitLabels_ = std::move(labels);
  Q_EMIT changed(Change::Fit);
}

}  // namespace finestra::ui

#pragma once
// Line labels of measured peaks for display: from a fit or assignment result, and for the peaks a
// project pins to a line. The labels come from core (the model's line names); this file only
// formats them as "C1·cl0" (line C1 of orientation class 0).
#include <QVector>

#include "core/fit/project_fit.h"
#include "ui/document.h"

namespace finestra::ui {

/// "C1·cl0" from a core line label and a class.
QString peakLabelText(const std::string& lineLabel, int cls);
QString peakLabelText(const QString& lineLabel, int cls);

/// One label per assigned peak of a fit or assignment result (outliers have none).
QVector<PeakLabel> labelsOfFit(const FitResult& result);

/// Labels of the peaks the project pins to a line, named by core's model of the project at each
/// measurement's field. Empty when the project cannot be prepared for fitting (bad input is
/// reported by the views that compute, not here).
QVector<PeakLabel> pinnedLabels(const Project& project);

}  // namespace finestra::ui

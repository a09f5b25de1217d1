#include "ui/fit/fit_view.h"
#include "ui/planner/planner_view.h"
#include "ui/result_view.h"
#include "ui/views/lambda_table_view.h"
#include "ui/views/levels_view.h"
#include "ui/views/line_table_view.h"
#include "ui/views/lines_view.h"
#include "ui/views/microwave_view.h"
#include "ui/views/spectrum_view.h"

namespace finestra::ui {

const std::vector<ViewEntry>& viewCatalogue() {
  static const std::vector<ViewEntry> views{
      {"levels", "Level fans", makeView<LevelsView>},
      {"lines", "Line map", makeView<LinesView>},
      {"spectrum", "Spectrum", makeView<SpectrumView>},
      {"table", "Line table", makeView<LineTableView>},
      {"microwave", "Microwave resonances", makeView<MicrowaveView>},
      {"lambda", "\u039b systems", makeView<LambdaTableView>},
      {"planner", "Magnet planner", makeView<PlannerView>},
      {"fit", "Assignment and fit", makeView<FitView>},
  };
  return views;
}

const ViewEntry* findView(const QString& key) {
  for (const ViewEntry& v : viewCatalogue())
    if (v.key == key) return &v;
  return nullptr;
}

}  // namespace finestra::ui

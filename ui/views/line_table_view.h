#pragma once
// The lines at the current field as a table (the same table finestra-cli prints), copyable as
// tab-separated text (Ctrl+C copies the selection; the button copies everything).
#include <QTableWidget>

#include "ui/result_view.h"

namespace finestra::ui {

class LineTableView : public ResultView {
  Q_OBJECT
public:
  explicit LineTableView(const ViewContext& context, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  Table dataTable() const override { return table_; }
  /// Selected cells (or everything when nothing is selected) as tab-separated text.
  QString selectionText() const;

private:
  QTableWidget* widget_ = nullptr;
  Table table_;
};

}  // namespace finestra::ui

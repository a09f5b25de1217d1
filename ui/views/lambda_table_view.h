#pragma once
// Λ systems at the project's field as a table (the same numbers as finestra-cli lambda-systems),
// ranked by the figure chosen above the table.
#include <QTableWidget>

#include "ui/result_view.h"

class QComboBox;

namespace finestra::ui {

class LambdaTableView : public ResultView {
  Q_OBJECT
public:
  explicit LambdaTableView(const ViewContext& context, QWidget* parent = nullptr);
  void showResult(const ResultPtr& result) override;
  Table dataTable() const override { return table_; }

private:
  void refill();

  QComboBox* ranking_ = nullptr;
  QTableWidget* widget_ = nullptr;
  ResultPtr result_;
  Table table_;
};

}  // namespace finestra::ui

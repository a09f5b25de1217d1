#include "ui/views/lambda_table_view.h"

#include <QComboBox>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QVBoxLayout>

#include "core/report/resonance_reports.h"

namespace finestra::ui {

LambdaTableView::LambdaTableView(const ViewContext& context, QWidget* parent)
    : ResultView(context, parent), ranking_(new QComboBox(this)), widget_(new QTableWidget(this)) {
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(4, 4, 4, 4);
  auto* bar = new QHBoxLayout;
  bar->addWidget(new QLabel(tr("Λ systems at the current field: an excited level and two ground levels j, k joined by "
                               "allowed lines (same numbers as finestra-cli lambda-systems). Rank by:"),
                            this));
  ranking_->addItem(tr("product of strengths"), QStringLiteral("product"));
  ranking_->addItem(tr("balance"), QStringLiteral("balance"));
  ranking_->addItem(tr("branching"), QStringLiteral("branching"));
  ranking_->addItem(tr("smallest two-photon detuning"), QStringLiteral("two_photon"));
  bar->addWidget(ranking_);
  bar->addStretch(1);
  layout->addLayout(bar);
  layout->addWidget(widget_, 1);
  widget_->setEditTriggers(QAbstractItemView::NoEditTriggers);
  widget_->setAlternatingRowColors(true);
  widget_->verticalHeader()->setVisible(false);
  connect(ranking_, &QComboBox::currentIndexChanged, this, [this] { refill(); });
}

void LambdaTableView::showResult(const ResultPtr& result) {
  result_ = result;
  refill();
}

void LambdaTableView::refill() {
  table_ = {};
  if (result_ && result_->model) {
    const LambdaRanking ranking = parseLambdaRanking(ranking_->currentData().toString().toStdString(), "ranking");
    const int nuclearDim = result_->model->manifold(Manifold::Ground).nuclearDim;
    std::vector<ClassLambda> lambdas;
    for (const ClassSolution& s : result_->current) lambdas.push_back(lambdaSystems(s, nuclearDim, ranking));
    table_ = lambdaTable(lambdas);
  }
  widget_->clear();
  widget_->setColumnCount(static_cast<int>(table_.headers.size()));
  widget_->setRowCount(static_cast<int>(table_.rows.size()));
  QStringList headers;
  for (const auto& h : table_.headers) headers << QString::fromStdString(h);
  widget_->setHorizontalHeaderLabels(headers);
  for (std::size_t r = 0; r < table_.rows.size(); ++r)
    for (std::size_t c = 0; c < table_.rows[r].size(); ++c) {
      auto* item = new QTableWidgetItem(QString::fromStdString(table_.rows[r][c]));
      item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
      widget_->setItem(static_cast<int>(r), static_cast<int>(c), item);
    }
  widget_->resizeColumnsToContents();
}

}  // namespace finestra::ui

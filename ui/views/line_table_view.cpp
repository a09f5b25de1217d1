#include "ui/views/line_table_view.h"

#include <QApplication>
#include <QClipboard>
#include <QHBoxLayout>
#include <QHeaderView>
#include <QLabel>
#include <QPushButton>
#include <QShortcut>
#include <QVBoxLayout>

#include "core/report/reports.h"

namespace finestra::ui {

LineTableView::LineTableView(const ViewContext& context, QWidget* parent)
    : ResultView(context, parent), widget_(new QTableWidget(this)) {
  auto* layout = new QVBoxLayout(this);
  layout->setContentsMargins(4, 4, 4, 4);
  auto* bar = new QHBoxLayout;
  auto* copy = new QPushButton(tr("Copy table"), this);
  copy->setToolTip(tr("Copy the selected cells, or the whole table, as tab-separated text"));
  bar->addWidget(new QLabel(tr("Lines of the selected classes at the current field (same numbers as finestra-cli lines)"), this));
  bar->addStretch(1);
  bar->addWidget(copy);
  layout->addLayout(bar);
  layout->addWidget(widget_, 1);
  widget_->setEditTriggers(QAbstractItemView::NoEditTriggers);
  widget_->setSelectionMode(QAbstractItemView::ExtendedSelection);
  widget_->setAlternatingRowColors(true);
  widget_->verticalHeader()->setVisible(false);
  connect(copy, &QPushButton::clicked, this, [this] { QApplication::clipboard()->setText(selectionText()); });
  auto* shortcut = new QShortcut(QKeySequence::Copy, widget_);
  connect(shortcut, &QShortcut::activated, this, [this] { QApplication::clipboard()->setText(selectionText()); });
}

void LineTableView::showResult(const ResultPtr& result) {
  table_ = result->model ? linesTable(*result->model, result->current) : Table{};
  widget_->clear();
  widget_->setColumnCount(static_cast<int>(table_.headers.size()));
  widget_->setRowCount(static_cast<int>(table_.rows.size()));
  QStringList headers;
  for (const auto& h : table_.headers) headers << QString::fromStdString(h);
  widget_->setHorizontalHeaderLabels(headers);
  for (std::size_t r = 0; r < table_.rows.size(); ++r)
    for (std::size_t c = 0; c < table_.rows[r].size(); ++c) {
      auto* item = new QTableWidgetItem(QString::fromStdString(table_.rows[r][c]));
      if (c != 1) item->setTextAlignment(Qt::AlignRight | Qt::AlignVCenter);
      widget_->setItem(static_cast<int>(r), static_cast<int>(c), item);
    }
  widget_->resizeColumnsToContents();
}

QString LineTableView::selectionText() const {
  const auto ranges = widget_->selectedRanges();
  int top = 0, bottom = widget_->rowCount() - 1, left = 0, right = widget_->columnCount() - 1;
  bool headers = true;
  if (!ranges.isEmpty()) {
    top = ranges.front().topRow();
    bottom = ranges.front().bottomRow();
    left = ranges.front().leftColumn();
    right = ranges.front().rightColumn();
    for (const auto& r : ranges) {
      top = std::min(top, r.topRow());
      bottom = std::max(bottom, r.bottomRow());
      left = std::min(left, r.leftColumn());
      right = std::max(right, r.rightColumn());
    }
    headers = top == 0 && bottom == widget_->rowCount() - 1;
  }
  QStringList lines;
  if (headers) {
    QStringList cells;
    for (int c = left; c <= right; ++c) cells << QString::fromStdString(table_.headers[static_cast<std::size_t>(c)]);
    lines << cells.join('\t');
  }
  for (int r = top; r <= bottom; ++r) {
    QStringList cells;
    for (int c = left; c <= right; ++c) {
      const QTableWidgetItem* item = widget_->item(r, c);
      cells << ((ranges.isEmpty() || (item && item->isSelected())) && item ? item->text() : QString());
    }
    lines << cells.join('\t');
  }
  return lines.join('\n') + '\n';
}

}  // namespace finestra::ui

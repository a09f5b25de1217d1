#include "ui/log_panel.h"

#include <algorithm>
#include <spdlog/spdlog.h>

namespace finestra::ui {

void QtLogSink::sink_it_(const spdlog::details::log_msg& msg) {
  spdlog::memory_buf_t formatted;
  formatter_->format(msg, formatted);
  QString text = QString::fromUtf8(formatted.data(), static_cast<qsizetype>(formatted.size())).trimmed();
  Q_EMIT relay_->message(text, static_cast<int>(msg.level));
}

LogPanel::LogPanel(QWidget* parent) : QPlainTextEdit(parent) {
  setReadOnly(true);
  setMaximumBlockCount(2000);
  QFont f("monospace");
  f.setStyleHint(QFont::TypeWriter);
  f.setPointSize(9);
  setFont(f);
  connect(relay_.get(), &LogRelay::message, this, &LogPanel::append, Qt::QueuedConnection);
}

void LogPanel::attachToDefaultLogger() {
  sink_ = std::make_shared<QtLogSink>(relay_);
  sink_->set_pattern("%H:%M:%S  %l  %v");
  spdlog::default_logger()->sinks().push_back(sink_);
}

LogPanel::~LogPanel() {
  if (!sink_) return;
  auto& sinks = spdlog::default_logger()->sinks();
  sinks.erase(std::remove(sinks.begin(), sinks.end(), sink_), sinks.end());
}

void LogPanel::append(const QString& text, int level) {
  const QString colour = level >= spdlog::level::err ? "#A02030" : level == spdlog::level::warn ? "#9A6400" : "#303030";
  appendHtml(QStringLiteral("<span style=\"color:%1\">%2</span>").arg(colour, text.toHtmlEscaped()));
}

}  // namespace finestra::ui

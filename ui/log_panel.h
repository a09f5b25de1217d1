#pragma once
// Log panel fed by spdlog: a sink that forwards each formatted message to a QObject through a
// queued signal, so messages logged from worker threads reach the widget on the GUI thread.
#include <QPlainTextEdit>
#include <memory>
#include <mutex>
#include <spdlog/sinks/base_sink.h>

namespace finestra::ui {

/// Receives log lines on whatever thread logs and re-emits them as a Qt signal.
class LogRelay : public QObject {
  Q_OBJECT
Q_SIGNALS:
  void message(const QString& text, int level);
};

class QtLogSink : public spdlog::sinks::base_sink<std::mutex> {
public:
  explicit QtLogSink(std::shared_ptr<LogRelay> relay) : relay_(std::move(relay)) {}

protected:
  void sink_it_(const spdlog::details::log_msg& msg) override;
  void flush_() override {}

private:
  std::shared_ptr<LogRelay> relay_;
};

class LogPanel : public QPlainTextEdit {
  Q_OBJECT
public:
  explicit LogPanel(QWidget* parent = nullptr);
  /// Installs a sink on the default spdlog logger (keeping its other sinks).
  void attachToDefaultLogger();
  ~LogPanel() override;

private:
  void append(const QString& text, int level);
  std::shared_ptr<LogRelay> relay_ = std::make_shared<LogRelay>();
  std::shared_ptr<QtLogSink> sink_;
};

}  // namespace finestra::ui

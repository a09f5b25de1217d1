#pragma once
// Error types. Every error thrown by core names what is at fault (a key, a file and line, a
// parameter) so that the CLI and GUI can show it unchanged to the user.
#include <stdexcept>
#include <string>

#include "core/common/text_escape.h"

namespace finestra {

/// Bad input: a value, key or file the user supplied. `where` names the key path or file:line;
/// what() is the combined text "where: message" (just the message when `where` is empty). Both
/// parts pass through escapeControlCharacters: text echoed from the input never reaches a terminal
/// or a dialog raw.
class InputError : public std::runtime_error {
public:
  InputError(const std::string& where, const std::string& message)
      : InputError(Escaped{escapeControlCharacters(where), escapeControlCharacters(message)}) {}
  const std::string& where() const { return where_; }
  /// The key path or file:line at fault (the same as where()).
  const std::string& keyPath() const { return where_; }
  /// The message without the key path.
  const std::string& message() const { return message_; }

private:
  struct Escaped {
    std::string where, message;
  };
  explicit InputError(Escaped e)
      : std::runtime_error(e.where.empty() ? e.message : e.where + ": " + e.message), where_(std::move(e.where)),
        message_(std::move(e.message)) {}

  std::string where_;
  std::string message_;
};

/// A computation needs a model value that is not known (e.g. a preset marks it "unknown").
class MissingValueError : public InputError {
public:
  using InputError::InputError;
};

}  // namespace finestra

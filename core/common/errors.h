#pragma once
// Error types. Every error thrown by core names what is at fault (a key, a file and line, a
// parameter) so that the CLI and GUI can show it unchanged to the user.
#include <stdexcept>
#include <string>

namespace finestra {

/// Bad input: a value, key or file the user supplied. `where` names the key path or file:line.
class InputError : public std::runtime_error {
public:
  InputError(std::string where, const std::string& what)
      : std::runtime_error(where.empty() ? what : where + ": " + what), where_(std::move(where)) {}
  const std::string& where() const { return where_; }

private:
  std::string where_;
};

/// A computation needs a model value that is not known (e.g. a preset marks it "unknown").
class MissingValueError : public InputError {
public:
  using InputError::InputError;
};

}  // namespace finestra

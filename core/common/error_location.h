#pragma once
// Placing an error found inside a document (a key path) into the file it came from.
#include <string>

#include "core/common/errors.h"

namespace finestra {

/// The same error located inside `origin` (a file name): key path "origin: keyPath", message kept.
inline InputError locatedIn(const InputError& e, const std::string& origin) {
  return InputError(e.keyPath().empty() ? origin : origin + ": " + e.keyPath(), e.message());
}

}  // namespace finestra

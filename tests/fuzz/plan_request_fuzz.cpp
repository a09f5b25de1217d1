// libFuzzer target: the plan request reader and its validation, including the reachable directions
// it would allocate. Any input must either be accepted or throw InputError; nothing may crash, hang
// or allocate beyond the stated limits (core/common/limits.h).
#include <cstddef>
#include <cstdint>
#include <string>

#include "core/common/errors.h"
#include "core/planner/plan_request.h"
#include "core/planner/planner.h"

extern "C" int LLVMFuzzerTestOneInput(const std::uint8_t* data, std::size_t size) {
  const std::string text(reinterpret_cast<const char*>(data), size);
  const finestra::PlanRequest defaults;
  try {
    const finestra::PlanRequest request = finestra::parsePlanRequest(text, "fuzz-plan.json", defaults);
    finestra::validatePlanRequest(request);
    (void)finestra::reachableDirections(request.reach);
  } catch (const finestra::InputError&) {
  }
  return 0;
}

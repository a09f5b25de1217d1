#include "core/model/zpl_anchor.h"

#include <cmath>
#include <sstream>

#include "core/common/errors.h"
#include "core/units/spectral_units.h"

namespace finestra {

ModelSetup anchorZpl(ModelSetup setup, const ZplAnchor& anchor) {
  if (anchor.line < 'A' || anchor.line > 'D') throw InputError("centre.zpl_anchor.line", "expected A, B, C or D");
  if (!(anchor.wavelengthNm > 100 && anchor.wavelengthNm < 2000))
    throw InputError("centre.zpl_anchor.wavelength_nm", "must lie between 100 and 2000 nm");
  if (!(anchor.temperatureK >= 0 && anchor.temperatureK <= 1000))
    throw InputError("centre.zpl_anchor.temperature_K", "must lie between 0 and 1000 K");
  const double anchorGHz =
      toAbsoluteGHz(anchor.wavelengthNm, anchor.air ? SpectralUnit::NmAir : SpectralUnit::NmVacuum, 0.0);

  // Line frequencies are ν_ZPL + (E_u − E_g): the offset of the anchor line from the centroid does
  // not depend on the centroid, so one evaluation with the preset centroid gives it.
  ModelSetup probe = setup;
  probe.strain = StrainSetting{};
  probe.conditions.temperatureK = anchor.temperatureK;
  const CentreModel model(probe);
  const ClassSolution s = model.solve(0, Vec3::Zero());
  double sum = 0;
  int count = 0;
  for (const OpticalLine& l : s.lines)
    if (l.parent == anchor.line) {
      sum += l.frequencyGHz;
      ++count;
    }
  if (count == 0) throw InputError("centre.zpl_anchor.line", std::string("no ") + anchor.line + " line in the model");
  const double centroidUsedGHz = setup.centre.parameters.get(Param::ZplTHz) * 1e3;
  const double offsetGHz = sum / count - centroidUsedGHz;
  const double centroidTHz = (anchorGHz - offsetGHz) * 1e-3;

  auto& prov = setup.centre.provenance[static_cast<std::size_t>(Param::ZplTHz)];
  std::ostringstream source;
  source << "solved from the " << anchor.line << " line at " << anchor.wavelengthNm << " nm ("
         << (anchor.air ? "air" : "vacuum") << ", " << anchor.temperatureK << " K), project file";
  prov.value = centroidTHz;
  prov.status = ValueStatus::UserSet;
  prov.source = source.str();
  setup.centre.parameters.set(Param::ZplTHz, centroidTHz);
  return setup;
}

}  // namespace finestra

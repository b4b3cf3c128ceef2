#include "post/eddy_output.hpp"

#include <algorithm>
#include <cmath>
#include <numbers>

#include <fmt/format.h>

#include "post/atomic_file.hpp"
#include "post/tables.hpp"
#include "post/vtu.hpp"

namespace tf::post {
namespace {

double rpm(double rad_s) { return rad_s * 30.0 / std::numbers::pi; }

}  // namespace

void write_torque_speed(const std::filesystem::path& path, const std::vector<SpeedResult>& rows, int) {
  write_atomically(path, [&](std::ostream& o) {
    const bool slip = !rows.front().components.empty();
    o << "speed_rad_per_s,speed_rpm,slip,torque_N_m," << (slip ? "torque_gap_power_N_m" : "torque_lorentz_N_m")
      << ",rotor_loss_W,rotor_loss_balance_W,stator_loss_W,input_power_W,mechanical_power_W";
    const std::size_t m = rows.front().emf_rms.size();
    for (std::size_t k = 0; k < m; ++k) o << ",emf_" << phase_name(static_cast<int>(k)) << "_V_rms";
    if (slip)
      for (const char* c : {"forward", "backward"})
        o << fmt::format(",slip_{0},torque_{0}_N_m,rotor_loss_{0}_W", c);
    o << '\n';
    for (const auto& r : rows) {
      o << fmt::format("{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g},{:.10g}", r.rotor_speed,
                       rpm(r.rotor_speed), r.slip, r.torque, r.torque_lorentz, r.rotor_loss, r.rotor_loss_balance,
                       r.stator_loss, r.input_power, r.torque * r.rotor_speed);
      for (double e : r.emf_rms) o << fmt::format(",{:.10g}", e);
      for (const auto& c : r.components) o << fmt::format(",{:.10g},{:.10g},{:.10g}", c.slip, c.torque, c.rotor_loss);
      o << '\n';
    }
  });
}

SpeedAxis speed_collection_axis(const std::vector<SpeedResult>& written) {
  const auto monotone = [&](auto value, double sign) {
    for (std::size_t k = 1; k < written.size(); ++k)
      if (!(sign * (value(written[k]) - value(written[k - 1])) > 0.0)) return false;
    return true;
  };
  const auto speed = [](const SpeedResult& r) { return r.rotor_speed; };
  const auto slip = [](const SpeedResult& r) { return r.slip; };
  SpeedAxis axis;
  if (monotone(speed, 1.0)) {
    axis.name = "speed_rpm";
    for (const auto& r : written) axis.values.push_back(rpm(r.rotor_speed));
  } else if (monotone(slip, 1.0) && std::all_of(written.begin(), written.end(), [](const SpeedResult& r) {
               return std::isfinite(r.slip);
             })) {
    axis.name = "slip";
    for (const auto& r : written) axis.values.push_back(r.slip);
  } else {
    axis.name = "speed_number";
    for (std::size_t k = 0; k < written.size(); ++k) axis.values.push_back(static_cast<double>(k));
  }
  return axis;
}

FieldMetadata speed_metadata(int speed_number, const SpeedResult& row, double frequency,
                             const std::vector<std::complex<double>>& currents, const std::string& axis) {
  FieldMetadata info;
  info.numbers = {{"speed_number", speed_number},
                  {"speed_rad_per_s", row.rotor_speed},
                  {"speed_rpm", rpm(row.rotor_speed)},
                  {"slip", row.slip},
                  {"frequency_Hz", frequency},
                  {"rotor_angle_deg", 0.0}};
  for (std::size_t k = 0; k < currents.size(); ++k) {
    const std::string phase = phase_name(static_cast<int>(k));
    info.numbers.emplace_back("current_" + phase + "_peak_A", std::abs(currents[k]));
    info.numbers.emplace_back("current_" + phase + "_phase_deg", std::arg(currents[k]) * 180.0 / std::numbers::pi);
  }
  info.texts = {{"collection_time", axis}};
  return info;
}

}  // namespace tf::post

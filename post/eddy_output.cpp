#include "post/eddy_output.hpp"

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

}  // namespace tf::post

#pragma once
// Measures of a periodic waveform sampled at equal steps over whole periods (a back-EMF over the
// rotor positions of a study): rms and total harmonic distortion.

#include <vector>

namespace tf::post {

/// Root mean square of the samples (over whole periods this is the waveform's rms); 0 when empty.
double rms(const std::vector<double>& samples);

/// Total harmonic distortion as IEEE Std 519-2014 and IEC 61000-2-2 define it
/// (their definitions, from memory): the
/// rms of the harmonic content over the rms of the fundamental, THD = sqrt(sum_{h=2}^{H} X_h^2) / X_1.
/// The samples are N equally spaced values over `periods` whole periods of the fundamental, so
/// harmonic h is DFT bin h * periods (bins between harmonics, and the mean, are no harmonics).
/// H is max_order (50 in IEEE 519) or the highest order below the Nyquist bin N / 2, whichever is
/// lower. NaN when the fundamental is zero to round-off, or when periods < 1.
double total_harmonic_distortion(const std::vector<double>& samples, int periods, int max_order = 50);

/// The highest order that total_harmonic_distortion counts for these sizes.
int highest_harmonic(int n_samples, int periods, int max_order = 50);

}  // namespace tf::post

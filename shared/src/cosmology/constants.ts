/**
 * Physical and astronomical constants, each from the standard that defines it.
 * Every value is in SI unless its name says otherwise.
 */

/** Speed of light in vacuum, m s⁻¹ (SI 2019, exact). */
export const SPEED_OF_LIGHT_M_S = 299_792_458;
/** Speed of light in km s⁻¹ (SI 2019, exact). */
export const SPEED_OF_LIGHT_KM_S = SPEED_OF_LIGHT_M_S / 1000;

/** Astronomical unit, m (IAU 2012 Resolution B2, exact). */
export const AU_M = 149_597_870_700;
/** Parsec, m: (648 000 / π) au (IAU 2015 Resolution B2). */
export const PARSEC_M = (648_000 / Math.PI) * AU_M;
/** Megaparsec, m. */
export const MPC_M = 1e6 * PARSEC_M;
/** Megaparsec, cm. */
export const MPC_CM = MPC_M * 100;

/** Julian year, s: 365.25 × 86 400 s (IAU). */
export const JULIAN_YEAR_S = 365.25 * 86_400;
/** Gigayear (10⁹ Julian years), s. */
export const GYR_S = 1e9 * JULIAN_YEAR_S;
/** Light-year, m: c × Julian year (IAU). */
export const LIGHT_YEAR_M = SPEED_OF_LIGHT_M_S * JULIAN_YEAR_S;

/** Newtonian constant of gravitation, m³ kg⁻¹ s⁻² (CODATA 2018). */
export const GRAVITATIONAL_CONSTANT_SI = 6.6743e-11;
/** Nominal solar mass parameter GM☉, m³ s⁻² (IAU 2015 Resolution B3). */
export const SOLAR_MASS_PARAMETER_SI = 1.3271244e20;
/** Solar mass, kg: GM☉ / G (IAU 2015 B3 with CODATA 2018 G). */
export const SOLAR_MASS_KG = SOLAR_MASS_PARAMETER_SI / GRAVITATIONAL_CONSTANT_SI;

/** Boltzmann constant, J K⁻¹ (SI 2019, exact). */
export const BOLTZMANN_J_K = 1.380649e-23;
/** Elementary charge, C (SI 2019, exact); also J per eV. */
export const ELECTRON_VOLT_J = 1.602176634e-19;
/** Boltzmann constant in eV K⁻¹ (SI 2019, exact ratio). */
export const BOLTZMANN_EV_K = BOLTZMANN_J_K / ELECTRON_VOLT_J;
/** Planck constant, J s (SI 2019, exact). */
export const PLANCK_J_S = 6.62607015e-34;
/**
 * Stefan–Boltzmann constant, W m⁻² K⁻⁴, derived from the exact SI 2019 constants:
 * σ = 2π⁵ k⁴ / (15 h³ c²).
 */
export const STEFAN_BOLTZMANN_SI =
  (2 * Math.PI ** 5 * BOLTZMANN_J_K ** 4) / (15 * PLANCK_J_S ** 3 * SPEED_OF_LIGHT_M_S ** 2);

/** Present CMB temperature, K (Fixsen 2009, ApJ 707, 916: 2.72548 ± 0.00057 K). */
export const FIXSEN_2009_T_CMB_K = 2.72548;
/** Its 1σ uncertainty, K (Fixsen 2009). */
export const FIXSEN_2009_T_CMB_SIGMA_K = 0.00057;
/** Standard effective number of neutrino species (Mangano et al. 2005). */
export const STANDARD_N_EFF = 3.046;

/**
 * Neutrino-to-photon temperature ratio after e⁺e⁻ annihilation, (4/11)^(1/3)
 * (entropy conservation; e.g. Weinberg 2008, Cosmology, §3.1).
 */
export const NEUTRINO_TEMPERATURE_RATIO = Math.cbrt(4 / 11);
/**
 * Energy density of one relativistic neutrino species relative to photons:
 * (7/8)(4/11)^(4/3) (Fermi–Dirac factor times the temperature ratio to the fourth power).
 */
export const NEUTRINO_PER_SPECIES_RATIO = (7 / 8) * (4 / 11) ** (4 / 3);

/**
 * The Planck convention for the density of massive neutrinos: Ων h² = Σmν / 93.14 eV
 * (Planck 2018 results VI, §7.5 / Planck Collaboration 2020, A&A 641, A6).
 */
export const NEUTRINO_MASS_PER_OMEGA_H2_EV = 93.14;

/** Hubble constant unit km s⁻¹ Mpc⁻¹ expressed in s⁻¹. */
export const KM_S_MPC_IN_PER_S = 1000 / MPC_M;

/** Radians in one arcsecond. */
export const ARCSEC_RAD = Math.PI / 648_000;
/** Radians in one arcminute. */
export const ARCMIN_RAD = Math.PI / 10_800;
/** Radians in one degree. */
export const DEGREE_RAD = Math.PI / 180;
/** Steradians in one square degree. */
export const SQUARE_DEGREE_SR = DEGREE_RAD * DEGREE_RAD;

/** Hubble distance c/H0 in Mpc for H0 in km s⁻¹ Mpc⁻¹ (Hogg 1999, eq. 4). */
export function hubbleDistanceMpc(h0: number): number {
  return SPEED_OF_LIGHT_KM_S / h0;
}

/** Hubble time 1/H0 in Gyr for H0 in km s⁻¹ Mpc⁻¹ (Hogg 1999, eq. 3). */
export function hubbleTimeGyr(h0: number): number {
  return 1 / (h0 * KM_S_MPC_IN_PER_S) / GYR_S;
}

/** Critical density today 3H0²/(8πG) in kg m⁻³ for H0 in km s⁻¹ Mpc⁻¹. */
export function criticalDensityKgM3(h0: number): number {
  const h0PerS = h0 * KM_S_MPC_IN_PER_S;
  return (3 * h0PerS * h0PerS) / (8 * Math.PI * GRAVITATIONAL_CONSTANT_SI);
}

/**
 * Photon density parameter Ωγ = (4σT⁴/c³) / ρc for a black body at T0 (K), H0 in km s⁻¹ Mpc⁻¹.
 * (Radiation energy density u = 4σT⁴/c; divided by c² for mass density.)
 */
export function photonDensityParameter(tCmbK: number, h0: number): number {
  const photonMassDensity = (4 * STEFAN_BOLTZMANN_SI * tCmbK ** 4) / SPEED_OF_LIGHT_M_S ** 3;
  return photonMassDensity / criticalDensityKgM3(h0);
}

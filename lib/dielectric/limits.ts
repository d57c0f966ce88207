/**
 * Ranges the engine accepts and caps on request size. Each is stated in the error message when exceeded.
 */
export const LIMITS = {
  /** Lowest and highest frequency accepted anywhere, Hz. */
  minFrequency: 1,
  maxFrequency: 1e10,
  /** Particle outer radius, m (1 nm … 1 mm). */
  minRadius: 1e-9,
  maxRadius: 1e-3,
  /** Thinnest shell, m (0.1 nm: thinner than any molecular layer; also keeps the shell ratios finite). */
  minShellThickness: 1e-10,
  /** Relative permittivity of any explicitly given material. */
  minPermittivity: 1,
  maxPermittivity: 1e6,
  /** Conductivity of a particle material, S/m (0 allowed: an insulator). */
  maxParticleConductivity: 1e8,
  /** Medium conductivity, S/m (must be > 0). */
  minMediumConductivity: 1e-8,
  maxMediumConductivity: 100,
  /** Membrane specific capacitance, F/m² (> 0 … 1 F/m² = 100 µF/cm²). */
  maxCapacitance: 1,
  /** Membrane specific conductance, S/m² (0 … 1e9). */
  maxConductance: 1e9,
  /** Shells per particle. */
  maxShells: 8,
  /** Particles per request. */
  maxParticles: 16,
  /** Frequencies per spectrum. */
  maxSpectraFrequencies: 20001,
  /** Sweep axes and total grid points per particle. */
  maxSweepFrequencies: 2001,
  maxSweepConductivities: 1001,
  maxSweepPoints: 250_000,
} as const;

/**
 * Magnetic constant μ0 in N A⁻² (= T m A⁻¹), CODATA 2018 recommended value
 * 1.25663706212(19) × 10⁻⁶ (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)).
 *
 * Pinned on purpose (DOMAIN.md §6): since the 2019 SI revision μ0 is measured, and
 * CODATA 2022 (1.25663706127e-6, SciPy's current default) and the old exact 4π × 10⁻⁷
 * differ from this by −6.8e-10 and −5.4e-10 relative. Every field in core/physics uses
 * this one constant, so check values from DOMAIN.md §9 hold to 1e-10.
 *
 * @example vacuumPermeability / (2 * 0.1) // 6.2831853106e-6 T, centre of a 1 A·turn, 0.1 m loop
 */
export const vacuumPermeability = 1.25663706212e-6;

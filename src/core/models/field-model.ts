/**
 * The contract between the fit-model catalog (core/models) and the fitting engine
 * (core/fit). Every model in DESIGN.md's catalog implements FieldModel.
 */

/** Catalog ids; part of the CLI and JSON contract (DESIGN.md). */
export type ModelId =
  | 'loop'
  | 'thick-coil'
  | 'solenoid'
  | 'coil-pair'
  | 'rectangle'
  | 'dipole'
  | 'power-law'
  | 'inverse-square'
  | 'inverse-cube';

/** Unit of a parameter in SI, as it appears in the JSON report. */
export type ParameterUnit = 'A' | 'm' | 'T' | 'A·m²' | '1' | 'T·m^n' | 'rad';

/**
 * What a parameter does to the survey curve (DOMAIN.md §5), so that the fit and the
 * analyses never guess it from names or units:
 * - 'amplitude': the source strength; every reading is linear in it (ampereTurns, moment,
 *   a power law's amplitude);
 * - 'geometry': a length of the source that changes the curve's normalised shape (radius,
 *   lengths, separation, sides);
 * - 'offset': the probe offset, shifting the curve along the distance axis;
 * - 'centre': a scan's centre, the position of the datum along a signed scan axis (also a
 *   transverse scan's lateralCentre and a 3-D map's centreX, centreY, centreZ);
 * - 'orientation': the direction of a posed coil's axis (a 3-D map's tilt and azimuth);
 * - 'background': a constant added to every reading;
 * - 'exponent': a power law's slope on log–log axes.
 */
export type ParameterRole = 'amplitude' | 'geometry' | 'offset' | 'centre' | 'orientation' | 'background' | 'exponent';

export interface ParameterSpec {
  /** Name used in --fix, spec files and JSON (camelCase: ampereTurns, radius, probeOffset). */
  readonly name: string;
  readonly unit: ParameterUnit;
  /** What the parameter does to the curve; code asks this, never the name or unit. */
  readonly role: ParameterRole;
  /** Hard bounds the fit respects (SI). Use ±Infinity for none. */
  readonly lower: number;
  readonly upper: number;
  /** One line for people: "ampere-turns N·I". */
  readonly description: string;
}

/**
 * Survey points in struct-of-arrays form (SI), ready for tight loops.
 * `kind` says what the reading is: 'magnitude' → the model predicts |B| (+ background);
 * 'axial' → the model predicts the signed axial component B_z (+ background).
 */
export interface SurveyPoints {
  readonly n: number;
  readonly distance: Float64Array;
  readonly radial: Float64Array;
  readonly field: Float64Array;
  readonly kind: 'magnitude' | 'axial';
  /**
   * A 3-D map's positions (m, the map's frame; Survey.axis 'map'), one per point, read by
   * poseModel (pose-model.ts) in place of distance and radial; absent otherwise.
   */
  readonly map?: {
    readonly x: Float64Array;
    readonly y: Float64Array;
    readonly z: Float64Array;
    /** What each point reads: 0, 1, 2 the map's x, y, z component of B; −1 the magnitude |B|. */
    readonly component: Int8Array;
  };
}

export interface FieldModel {
  readonly id: ModelId;
  /** Short name for people: "circular loop (elliptic integrals)". */
  readonly label: string;
  /** True for physical coil models, false for descriptive power laws. */
  readonly physical: boolean;
  readonly parameters: readonly ParameterSpec[];
  /**
   * Predicted reading at every point for parameter vector `params` (order of
   * `parameters`, SI), written into `out` (length n). Must not allocate per point.
   */
  evaluate(params: Float64Array, points: SurveyPoints, out: Float64Array): void;
  /**
   * Analytic Jacobian ∂prediction_i/∂params_j written row-major into `out`
   * (length n·k, out[i*k + j]). Omit when no analytic form is practical; the engine
   * then uses central differences.
   */
  jacobian?(params: Float64Array, points: SurveyPoints, out: Float64Array): void;
  /**
   * Optional fused form of `jacobian` for the fit's normal equations (the engine's
   * LeastSquaresProblem.normalEquations): with Jᵢⱼ = ((∂prediction_i/∂params_j)·weight[i])·
   * columnScale[j], accumulate in point order gram[u·k + v] += Jᵢᵤ·Jᵢᵥ (v ≤ u, k =
   * parameters.length) and gradient[u] += Jᵢᵤ·residuals[i], both arrays zeroed by the
   * caller. The derivatives must be those of `jacobian` to the last bit, so that a fit
   * is the same with or without it.
   */
  normalEquations?(
    params: Float64Array, points: SurveyPoints, weight: Float64Array, columnScale: Float64Array, residuals: Float64Array,
    gram: Float64Array, gradient: Float64Array,
  ): void;
  /**
   * Optional, for a model whose prediction depends on each reading only through its
   * distance r from the source at probe offset δ (the power laws): r and ln r of every
   * point at `offset`, written into `r` and `logR`, so that a search trying many values of
   * the other parameters at one δ (profileStart's exponent) works them out once.
   */
  sourceDistances?(offset: number, points: SurveyPoints, r: Float64Array, logR: Float64Array): void;
  /**
   * With sourceDistances: `evaluate` at `params` from the r and ln r that sourceDistances
   * gave for params' offset (`out.length` points), the same numbers to the last bit.
   */
  evaluateAtDistances?(params: Float64Array, r: Float64Array, logR: Float64Array, out: Float64Array): void;
  /** Data-driven starting values (SI, order of `parameters`), DOMAIN §1.1 heuristics. */
  initialGuess(points: SurveyPoints): Float64Array;
  /**
   * For a model whose readings cannot tell two parameter vectors apart (a rectangle on
   * its axis: width and height swap), rewrite `params` in place to the canonical one and
   * return true when it changed anything. `fixed[j]` marks parameters the user holds.
   */
  canonicalParameters?(params: Float64Array, points: SurveyPoints, fixed: readonly boolean[]): boolean;
  /**
   * Field of the source alone (no background) at one survey position, with the model's
   * distance datum and probe offset applied: out[0] = axial component B_z, out[1] = radial
   * component B_ρ (T). Descriptive power laws have no direction: their value goes in
   * out[0] and out[1] = 0. Optional so that stand-in models in tests need not provide it;
   * every catalog model does.
   */
  components?(params: Float64Array, distance: number, radial: number, out: Float64Array): void;
}

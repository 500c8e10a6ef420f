/**
 * @module analysis/energy/control-constants
 * Shewhart control-chart constants for moving ranges of two consecutive observations (n = 2), and the
 * EWMA design used for small sustained shifts. Values from Montgomery, D. C., *Introduction to Statistical
 * Quality Control*, Appendix Table VI "Factors for constructing variables control charts", row n = 2
 * (checked against a copy of the table, 6th-edition page 720: d2 = 1.128, d3 = 0.853, D3 = 0, D4 = 3.267).
 */

/** Expected range of two independent standard normal values, d2(2) = 2/√π = 1.128 (Montgomery App. VI, n = 2). */
export const D2_MOVING_RANGE_OF_TWO = 1.128
/** Standard deviation of that range, d3(2) = 0.853 (Montgomery App. VI, n = 2). */
export const D3_SMALL_MOVING_RANGE_OF_TWO = 0.853
/** Lower control-limit factor of the range chart, D3(2) = 0 (Montgomery App. VI, n = 2). */
export const D3_MOVING_RANGE_OF_TWO = 0
/** Upper control-limit factor of the range chart, D4(2) = 1 + 3·d3/d2 = 3.267 (Montgomery App. VI, n = 2). */
export const D4_MOVING_RANGE_OF_TWO = 3.267
/** Width of Shewhart limits in standard deviations (Shewhart 1931; Montgomery ch. 5, "three-sigma limits"). */
export const SHEWHART_SIGMA_MULTIPLE = 3

/**
 * EWMA smoothing constant λ = 0.10 and limit width L = 2.814: the design with an in-control average run
 * length of about 500 points for λ = 0.10 (Lucas & Saccucci 1990, Technometrics 32:1, ARL table, as
 * reproduced in Montgomery's EWMA section; from memory). Checked here by simulation with the exact
 * (time-varying) limits: ARL0 ≈ 500 (test/analysis/energy/control-chart.test.ts). Montgomery's worked
 * example uses L = 2.7, which the same simulation puts near 360.
 */
export const EWMA_LAMBDA = 0.1
export const EWMA_LIMIT_WIDTH_L = 2.814

/** The citation the report prints beside the limits. */
export const CONTROL_CHART_SOURCE =
  'Limits: individuals x̄ ± 3·MR̄/d2, moving range UCL = D4·MR̄, LCL = D3·MR̄ with d2 = 1.128, D3 = 0, D4 = 3.267 ' +
  '(Montgomery, Introduction to Statistical Quality Control, Appendix Table VI, n = 2). Run rules: Western Electric ' +
  'Co. (1956), Statistical Quality Control Handbook. EWMA λ = 0.10, L = 2.814, in-control ARL ≈ 500 ' +
  '(Lucas & Saccucci 1990, as tabulated by Montgomery).'

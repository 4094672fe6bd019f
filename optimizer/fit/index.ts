// Public face of the fuel-curve fitting module (wired into optimizer/index.ts by the lead).
export {
  fitFuelCurve,
  fuelRateAt,
  sfocAt,
  sfocBandAt,
  lowestSfocLoadKw,
  withinDayFuelBiasKgPerH,
  type DailyFuelPoint,
  type ShopTestPoint,
  type FitFuelCurveOptions,
  type FuelCurvePriorOptions,
  type FuelCurveFit,
  type FittedCurve,
  type OutlierDay,
  type SfocBand,
  type SfocAtLoad,
} from './fuel-curve-fit';
export { fitDrift, type FitDriftOptions, type DriftResult, type DriftWindow } from './drift';
export {
  polynomialLeastSquares,
  boundedPolynomialLeastSquares,
  type LeastSquaresOptions,
  type LeastSquaresResult,
  type BoundedLeastSquaresResult,
} from './least-squares';
export { robustPolynomialLeastSquares, type RobustLeastSquaresOptions, type RobustLeastSquaresResult } from './robust-fit';
export { robustWeight, robustPsiDerivative, robustScale, HUBER_K, TUKEY_C, type RobustMethod } from './robust';
export { studentTCdf, studentTQuantile, regularizedIncompleteBeta } from './student-t';
export { generateDailyLogs, type SyntheticLogOptions } from './synthetic-logs';

// Speed (mph) and stopping distance (ft) of 50 cars, recorded in the 1920s: Ezekiel, M. (1930),
// Methods of Correlation Analysis, Wiley; distributed with R as the `cars` data set. Transcribed
// from a public JSON export of R's `cars`. Its published summary (mean speed 15.4, mean distance
// 42.98) is checked in the test as a guard against copying slips.

/** [speed, dist] in R's row order. */
export const CARS_ROWS: ReadonlyArray<readonly [number, number]> = [
  [4, 2], [4, 10], [7, 4], [7, 22], [8, 16], [9, 10], [10, 18], [10, 26], [10, 34], [11, 17],
  [11, 28], [12, 14], [12, 20], [12, 24], [12, 28], [13, 26], [13, 34], [13, 34], [13, 46], [14, 26],
  [14, 36], [14, 60], [14, 80], [15, 20], [15, 26], [15, 54], [16, 32], [16, 40], [17, 32], [17, 40],
  [17, 50], [18, 42], [18, 56], [18, 76], [18, 84], [19, 36], [19, 46], [19, 68], [20, 32], [20, 48],
  [20, 52], [20, 56], [20, 64], [22, 66], [23, 54], [24, 70], [24, 92], [24, 93], [24, 120], [25, 85],
];

/**
 * R's printed output for lm(dist ~ speed, data = cars), as quoted in several public R sessions:
 * summary(), confint() and predict(newdata = data.frame(speed = 10), interval = ...).
 * Strings keep the printed digits; the test allows half a unit in the last one.
 */
export const CARS_R_OUTPUT = {
  intercept: '-17.5791',
  interceptStdError: '6.7584',
  interceptT: '-2.601',
  interceptP: '0.0123',
  slope: '3.9324',
  slopeStdError: '0.4155',
  slopeT: '9.464',
  slopeP: '1.49e-12',
  residualStdError: '15.38',
  residualDf: 48,
  rSquared: '0.6511',
  rSquaredFull: '0.6510794',
  adjustedRSquared: '0.6438',
  fStatistic: '89.57',
  residualSumOfSquares: '11353.52',
  slopeInterval: ['3.096964', '4.767853'],
  interceptInterval: ['-31.167850', '-3.990340'],
  firstResiduals: ['3.849460', '11.849460', '-5.947766', '12.052234'],
  residualMin: '-29.069',
  residualMax: '43.201',
  at10: { fit: '21.74499', meanLower: '15.46192', meanUpper: '28.02807', lower: '-9.809601', upper: '53.29959' },
} as const;

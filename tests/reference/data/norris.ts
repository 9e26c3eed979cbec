// NIST Statistical Reference Datasets, linear least squares, "Norris" (lower difficulty):
// calibration of ozone monitors; y = customer's measurement, x = NIST's measurement, 36 rows.
// https://www.itl.nist.gov/div898/strd/lls/data/Norris.shtml (data file LINKS/DATA/Norris.dat).
// Transcribed from two independent public copies of that file, which agree row for row: the GNU
// Scientific Library's fit/test.c and the GAMS model library's LS01 test model.

/** [y, x] in the order of the certified file. */
export const NORRIS_ROWS: ReadonlyArray<readonly [number, number]> = [
  [0.1, 0.2], [338.8, 337.4], [118.1, 118.2], [888.0, 884.6],
  [9.2, 10.1], [228.1, 226.5], [668.5, 666.3], [998.5, 996.3],
  [449.1, 448.6], [778.9, 777.0], [559.2, 558.2], [0.3, 0.4],
  [0.1, 0.6], [778.1, 775.5], [668.8, 666.9], [339.3, 338.0],
  [448.9, 447.5], [10.8, 11.6], [557.7, 556.0], [228.3, 228.1],
  [998.0, 995.8], [888.8, 887.6], [119.6, 120.2], [0.3, 0.3],
  [0.6, 0.3], [557.6, 556.8], [339.3, 339.1], [888.0, 887.2],
  [998.5, 999.0], [778.9, 779.0], [10.2, 11.1], [117.6, 118.3],
  [228.9, 229.2], [668.4, 669.1], [449.2, 448.9], [0.2, 0.5],
];

/** Certified values, to the digits NIST prints (15 significant). */
export const NORRIS_CERTIFIED = {
  intercept: -0.262323073774029,
  interceptStdDev: 0.232818234301152,
  slope: 1.00211681802045,
  slopeStdDev: 0.429796848199937e-3,
  residualStdDev: 0.884796396144373,
  rSquared: 0.999993745883712,
  regressionDf: 1,
  regressionSumOfSquares: 4255954.13232369,
  regressionMeanSquare: 4255954.13232369,
  fStatistic: 5436385.54079785,
  residualDf: 34,
  residualSumOfSquares: 26.6173985294224,
  residualMeanSquare: 0.782864662630069,
} as const;

/**
 * The Student t table of METHODS.md: the 0.975 quantile at df 1, 2, 5, 10, 30, 120, to 6 decimals.
 * Each is a 40-digit mpmath root rounded to 6 decimals (tests/reference/t_family_reference.py, "0.975
 * quantiles"); printed t tables give the same numbers to fewer decimals (common practice). Shared by
 * the tests that check t quantiles.
 */
export const T_TABLE_0975: ReadonlyArray<readonly [df: number, quantile: number]> = [
  [1, 12.706205],
  [2, 4.302653],
  [5, 2.570582],
  [10, 2.228139],
  [30, 2.042272],
  [120, 1.97993],
];

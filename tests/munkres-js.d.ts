/** munkres-js ships no types: it takes a cost matrix and returns the chosen [row, column] pairs. */
declare module 'munkres-js' {
  function computeMunkres(costMatrix: number[][]): Array<[number, number]>;
  export default computeMunkres;
}

/**
 * The border fitter's limits, without zod: the planner reads them before its checks have loaded.
 * ./border-fit.ts re-exports them, so the server and the schemas keep importing from there.
 */

/** Past this an edge is a typing mistake, not a blanket: 2,000 stitches is several metres. */
export const MAX_EDGE_STITCHES = 2000;
export const MAX_MULTIPLE = 60;
export const MAX_OFFSET = 100;
export const MAX_PATTERN_ROWS = 12;
/** More than this in one corner stitch would ruffle whatever the border. */
export const MAX_CORNER_STITCHES = 9;

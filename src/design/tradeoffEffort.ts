/**
 * Fast-model evaluations one stage count's trade-off curve may take by default
 * (TradeoffOptions.effort, `design --curve-effort`). A module of its own, without imports, so that
 * the command line can name the default without loading the search.
 *
 * Measured on the bench machine: the curves of every bundled sample take 130 to 46 000
 * evaluations (0.2 s at most); the wide three-stage E12 bench project 284 000 (2.8 s); the same
 * space in E24 8.6 million (69 s), which this limit gives up after about 4 s instead.
 */
export const TRADEOFF_EFFORT = 500_000;

/** Quantities: reading and writing values with units, IEC 60062 codes and IEC 60063 series. */
export { parseQuantity, type ParseQuantityOptions } from './parseQuantity.js';
export { QuantityError } from './quantityError.js';
export { InputError } from './inputError.js';
export { DIMENSIONS, describeDimension, type Dimension, type DimensionInfo } from './dimension.js';
export { formatEng } from './formatEng.js';
export { formatIec60062 } from './formatIec60062.js';
export { E_SERIES, E_SERIES_NAMES, seriesValues, nearestInSeries, type ESeries } from './eSeries.js';

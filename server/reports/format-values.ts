// Numbers in print: the shared value labels and units, so a report says what a screen says.
export { formatHz, formatNumber, formatResultValue as formatValue, formatResultValues as formatValues } from '../../shared/labels/values';

export { FORMULA_START, neutralizeCsvCell } from './neutralize-csv-cell';

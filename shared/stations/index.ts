/** Station geometry of a survey line: CSV reading and table rules. */
export { checkStationTable, type StationIssue } from './rules';
export { parseStationCsv, type StationCsvResult } from './csv';

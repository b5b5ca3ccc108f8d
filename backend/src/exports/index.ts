export type { ConfirmedRow, ExportAssumptions, SpectrumClass, UnconfirmedMember } from './types';
export { CONFIRMED_COLUMNS, type ExportColumn } from './confirmedColumns';
export { toCsv } from './toCsv';
export { toEcsv } from './toEcsv';
export { toVotable, VOTABLE_NAMESPACE } from './toVotable';
export { toFitsTable } from './toFitsTable';
export { familyTable, type FamilyCheck, type FamilyMember } from './familyTable';
export { familyTableCsv } from './familyTableCsv';
export { fitsAscii } from './fitsAscii';

// Every label people read, one home per concept: screens, PDFs, e-mails and CSV exports import from here.
export * from './bases';
export * from './equipment';
export * from './fields';
export * from './humanize';
export * from './inspections';
export * from './records';
export * from './registers';
export * from './roles';
export * from './rules';
export * from './techniques';
export * from './trail-events';
export * from './values';
export * from './workflow';
export * from './permissions';

// Every table of the database, one file per domain.
export * from './auth';
export * from './roster';
export * from './library';
export * from './plans';
export * from './training';
export * from './mail';
export * from './billing';
export * from './meetday';
export * from './week';
export * from './requests';
export * from './talk';

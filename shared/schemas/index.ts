// zod contracts for requests and responses, used by server validation and client forms alike.
export * from './common';
export * from './auth';
export * from './rules';
export * from './plans';
export * from './training';
export * from './my-week';
export * from './videos';
export * from './invitations';
export * from './mail';
export * from './fees';
export * from './library';
export * from './roster';
export * from './meets';
export * from './meet-day';
export * from './loop';
export * from './week';
export * from './messages';

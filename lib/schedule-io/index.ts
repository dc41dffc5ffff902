export * from './columns';
export * from './mapping';
export * from './read';
export * from './rows';
export * from './write';

// Public API of the pure transport core (no DB, Next or React).
export * from './units';
export * from './physics';
export * from './quality';

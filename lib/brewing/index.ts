// The brewing engine: the recipe document and the pure maths around it.
// No I/O, clock or randomness: the same code runs on the server and in the browser.
export * from './schema';
export * from './stats';
export * from './extract';
export * from './bitterness';
export * from './colour';
export * from './alcohol';
export * from './gravity';
export * from './water';
export * from './mash-ph';
export * from './carbonation';
export * from './brewday';
export * from './scale';
export * from './fit-target';
export * from './water-targets';
export * from './yeast-temperature';
export * from './styles';
export * from './catalogue';
export * from './units';

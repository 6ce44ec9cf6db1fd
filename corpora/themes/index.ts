export * from './accounts.js';
export * from './all-themes.js';
export * from './courtesies.js';
export * from './foreign.js';
export * from './orders.js';
export * from './people.js';
export * from './pitches.js';
export * from './shop.js';

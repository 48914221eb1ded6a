export * from './client';
export * from './document';
export * from './schemas';
export { buildRecipeFilter, quoteFilterValue, viewerFilter } from './filters';

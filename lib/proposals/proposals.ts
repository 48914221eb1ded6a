// Proposals: the commands that change them and the views that read them.
export * from './commands';
export * from './views';

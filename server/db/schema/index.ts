export * from './auth';
export * from './organisations';
export * from './projects';

export * from './auth';
export * from './organisations';
export * from './projects';
export * from './structural-model';
export * from './site-records';

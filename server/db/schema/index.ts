export * from './auth';
export * from './organisations';
export * from './projects';
export * from './structural-model';
export * from './sign-in-attempts';
export * from './variants';
export * from './site-records';
export * from './sign-offs';

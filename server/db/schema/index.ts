export * from './auth';
export * from './organisations';
export * from './projects';
export * from './sign-in-attempts';

export * from './errors';
export * from './roles';
export * from './health';
export * from './me';
export * from './projects';
export * from './members';
export * from './app-config';
export * from './paging';

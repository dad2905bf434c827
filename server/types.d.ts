declare module 'express-mysql-session' {
  const factory: (session: unknown) => new (options: unknown, connection?: unknown) => unknown;
  export default factory;
}

declare module 'express-mysql-session' {
  const factory: (session: unknown) => new (options: Record<string, unknown>) => unknown;
  export default factory;
}

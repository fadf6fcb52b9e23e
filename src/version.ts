declare const __BRANCHTRACE_VERSION__: string | undefined;

/** Package version, injected by the bundler; '0.0.0-dev' when running from source (tests). */
export const VERSION: string =
  typeof __BRANCHTRACE_VERSION__ === 'string' ? __BRANCHTRACE_VERSION__ : '0.0.0-dev';

// The import rules of DEVELOPERS.md, checked by `npm run lint` (dependency-cruiser).
/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: 'shared-is-pure',
      comment: 'shared/ runs on both sides: it may import only shared/ and its small pure libraries.',
      severity: 'error',
      from: { path: '^shared/' },
      to: { pathNot: ['^shared/', '^node_modules/(zod|dinero\\.js|@dinero\\.js|@date-fns/tz)/'] },
    },
    {
      name: 'client-not-server',
      comment: 'The client (src/) never imports the server or the database layer.',
      severity: 'error',
      from: { path: '^src/' },
      to: { path: '^(server|db)/' },
    },
    {
      name: 'db-not-server',
      comment: 'db/ is below the server: it imports neither server/ nor src/.',
      severity: 'error',
      from: { path: '^db/' },
      to: { path: '^(server|src)/' },
    },
    {
      name: 'server-not-client',
      severity: 'error',
      from: { path: '^server/' },
      to: { path: '^src/' },
    },
    {
      name: 'server-domain-through-index',
      comment: "A server folder uses another folder's index.ts, never its inner files.",
      severity: 'error',
      from: { path: '^server/([^/]+)/' },
      to: { path: '^server/[^/]+/', pathNot: ['^server/$1/', '^server/[^/]+/index\\.ts$'] },
    },
    {
      name: 'server-root-through-index',
      comment: 'app.ts, index.ts and the other root files use a folder through its index.ts.',
      severity: 'error',
      from: { path: '^server/[^/]+\\.ts$' },
      to: { path: '^server/[^/]+/', pathNot: ['^server/[^/]+/index\\.ts$'] },
    },
    {
      name: 'not-to-unresolvable',
      severity: 'error',
      from: {},
      to: { couldNotResolve: true, pathNot: ['\\?url$', '^virtual:', '^~icons/'] },
    },
  ],
  options: {
    doNotFollow: { path: 'node_modules' },
    exclude: { path: '^(dist|test-results|playwright-report)/' },
    tsPreCompilationDeps: true,
    tsConfig: { fileName: 'tsconfig.node.json' },
    enhancedResolveOptions: {
      exportsFields: ['exports'],
      conditionNames: ['import', 'require', 'node', 'default'],
      extensions: ['.ts', '.js', '.mjs', '.vue', '.json'],
    },
    reporterOptions: { text: { highlightFocused: true } },
  },
}

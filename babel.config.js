// Expo's Babel preset, for Metro and for jest-expo's transformer alike. Under jest, `import()`
// becomes a promise of `require()`: Metro splits the web bundle at it (the password estimator's
// dictionaries load only when a new-password form needs them), but jest has no loader for it.
function dynamicImportToRequire({ types: t }) {
  return {
    name: 'fieldfile-dynamic-import-to-require',
    visitor: {
      CallExpression(path) {
        if (path.node.callee.type !== 'Import') return;
        const required = t.callExpression(t.identifier('require'), path.node.arguments);
        const resolved = t.callExpression(t.memberExpression(t.identifier('Promise'), t.identifier('resolve')), []);
        path.replaceWith(t.callExpression(t.memberExpression(resolved, t.identifier('then')), [t.arrowFunctionExpression([], required)]));
      },
    },
  };
}

module.exports = function (api) {
  // jest-expo calls Babel as "metro" too; jest itself is told apart by the variable it sets.
  const underJest = process.env.JEST_WORKER_ID !== undefined;
  api.cache.using(() => underJest);
  return { presets: ['babel-preset-expo'], plugins: underJest ? [dynamicImportToRequire] : [] };
};

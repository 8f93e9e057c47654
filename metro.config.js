// Metro config: Expo's defaults plus one redirect that keeps zod's unused locales out of the
// web bundle (see constants/zod-locales.js).
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

const ZOD_DIR = `${path.sep}node_modules${path.sep}zod${path.sep}`;
const ZOD_LOCALES_INDEX = /^\.\.\/locales\/index\.c?js$/;
const LOCALES_SHIM = path.resolve(__dirname, 'constants/zod-locales.js');

const upstreamResolve = config.resolver.resolveRequest;
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (ZOD_LOCALES_INDEX.test(moduleName) && context.originModulePath.includes(ZOD_DIR)) {
    return { type: 'sourceFile', filePath: LOCALES_SHIM };
  }
  return (upstreamResolve ?? context.resolveRequest)(context, moduleName, platform);
};

module.exports = config;

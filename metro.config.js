// Metro config: Expo's defaults, WOFF2 as an asset type, and one redirect that keeps zod's unused locales out of the
// web bundle (see constants/zod-locales.js).
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
// The shipped fonts are WOFF2 (assets/fonts).
config.resolver.assetExts = [...config.resolver.assetExts, 'woff2'];

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

// Learn more: Expo's metro config. Only one change from the defaults, for the web's first load.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);

/** zod's own `../locales/index.js` (from its classic and core entry points) → English only. */
const ZOD_ENTRY = /[\\/]node_modules[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/;
const ZOD_LOCALES = path.join(__dirname, 'scripts', 'metro', 'zod-locales.js');

config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && ZOD_ENTRY.test(context.originModulePath)) {
    return { type: 'sourceFile', filePath: ZOD_LOCALES };
  }
  return context.resolveRequest(context, moduleName, platform);
};

module.exports = config;

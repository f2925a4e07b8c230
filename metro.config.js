// Metro + NativeWind: global.css is compiled by tailwind at bundle time.
const path = require('node:path');
const { getDefaultConfig } = require('expo/metro-config');
const { withNativeWind } = require('nativewind/metro');

const config = getDefaultConfig(__dirname);
// The project's server, tests and data never belong in the web bundle
// (anchored to this folder so node_modules' own server/ folders still resolve).
const escape = (s) => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
config.resolver.blockList = ['server', 'tests', 'data', 'dist'].map(
  (dir) => new RegExp('^' + escape(path.join(__dirname, dir) + path.sep) + '.*'),
);

module.exports = withNativeWind(config, { input: './global.css' });

// Expo's Babel preset, for Metro and for jest-expo's transformer alike.
module.exports = function (api) {
  api.cache(true);
  return { presets: ['babel-preset-expo'] };
};

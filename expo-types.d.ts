// Expo's ambient types (assets, process.env.EXPO_PUBLIC_*). Not named expo-env.d.ts: `expo start`
// deletes that file when typed routes are off.
/// <reference types="expo/types" />

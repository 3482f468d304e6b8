// The web bundle's stand-in for zod's `locales` namespace (metro.config.js): English only. zod
// re-exports every language's messages from its index, which Metro cannot drop (about 270 KB of
// the first load); the app never asks for another language (`z.config(z.locales.xx())`).
export { default as en } from '../../node_modules/zod/v4/locales/en.js';

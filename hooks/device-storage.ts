/** The device's storage on the web (localStorage), or null where there is none (native, storage blocked). */
import { Platform } from 'react-native';

export type SyncStorage = Pick<Storage, 'getItem' | 'setItem' | 'removeItem'>;

export function deviceStorage(): SyncStorage | null {
  if (Platform.OS !== 'web' || typeof window === 'undefined') return null;
  try {
    // Reading the property throws where storage is blocked (some private modes).
    const s = window.localStorage;
    s.getItem('sightfan-probe');
    return s;
  } catch {
    return null;
  }
}

import { computed } from 'vue';
import { useSessionStore } from '@/stores/session';

const LITRES_PER_US_GALLON = 3.785411784;

/** Volumes are kept in litres and shown in the user's chosen units (US gallons or litres). */
export function useVolume() {
  const session = useSessionStore();
  const unit = computed<'gal' | 'L'>(() => (session.me?.user.unitSystem === 'metric' ? 'L' : 'gal'));
  function fromLitres(litres: number): number {
    return unit.value === 'gal' ? litres / LITRES_PER_US_GALLON : litres;
  }
  function format(litres: number, digits = 1): string {
    return `${fromLitres(litres).toLocaleString('en-US', { maximumFractionDigits: digits, minimumFractionDigits: digits })} ${unit.value}`;
  }
  /** A volume kept in US gallons (a storage capacity), shown in the user's units. */
  const formatGallons = (gallons: number, digits = 0) => format(gallons * LITRES_PER_US_GALLON, digits);
  return { unit, fromLitres, format, formatGallons };
}

export { equipmentKindLabels as kindLabels } from '@contracts/oil.js';

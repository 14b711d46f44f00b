import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces.js';
import { sheetUnits, sheetWords, type ApplicationSheetVersion, type EquipmentFacts } from '../server/contracts/application-sheet.js';
import { equipmentKindLabels } from '../server/contracts/oil.js';
import { renderPdf } from './pdf.js';

/** The application sheet of one piece of equipment, as a person hands it to a vendor or an engineer. */
export async function applicationSheetPdf(sheet: ApplicationSheetVersion, equipment: EquipmentFacts, caution: string): Promise<Buffer> {
  const c = sheet.content;
  const u = sheetUnits[c.unitSystem];
  const or = (value: string | number | null | undefined, unit = '') =>
    value === null || value === undefined || value === '' ? 'not given' : `${value}${unit ? ` ${unit}` : ''}`;
  const section = (title: string, rows: Array<[string, string]>): Content[] => [
    { text: title, bold: true, fontSize: 11, margin: [0, 8, 0, 2] },
    {
      table: { widths: [170, '*'], body: rows.map(([label, value]) => [{ text: label, color: '#444444' }, { text: value }]) },
      layout: 'lightHorizontalLines',
    },
  ];
  const dimensions =
    c.shape === 'rectangular' ? `${c.length} × ${c.width} ${u.length} (length × width)` : `${c.diameter} ${u.length} diameter`;
  const content: Content[] = [
    { text: 'Application sheet', fontSize: 16, bold: true },
    {
      text: `${equipment.name} · ${equipmentKindLabels[equipment.kind as keyof typeof equipmentKindLabels] ?? equipment.kind} · ${equipment.site}, ${equipment.company}`,
      color: '#444444',
    },
    {
      text: `Version ${sheet.version}, saved ${sheet.savedAt.slice(0, 10)} by ${sheet.savedByName}${sheet.reason ? ` (${sheet.reason})` : ''}`,
      color: '#444444',
      margin: [0, 0, 0, 6],
    },
    ...section('Tank or sump', [
      ['Serves', or(equipment.serves)],
      ['Discharge point downstream', or(equipment.pointCode)],
      ['Shape and size', `${sheetWords.shape[c.shape]}, ${dimensions}`],
      ['Tank depth', `${c.tankDepth} ${u.length}`],
      ['Working level (liquid depth)', `${c.workingLevel} ${u.length}, varies ± ${c.levelVariation} ${u.length}`],
      ['Surface area (computed)', sheet.computed.surfaceArea],
      ['Working volume (computed)', sheet.computed.workingVolume],
      ['Headroom above the lip', or(c.headroom, u.length)],
      ['Access above the tank', or(c.access)],
    ]),
    ...section('Water', [
      ['Flow', `${sheetWords.flowMode[c.flowMode]}: in ${c.flowIn} ${u.flow}, out ${c.flowOut} ${u.flow}`],
      ['Water temperature', `${c.waterTemperatureMin} to ${c.waterTemperatureMax} ${u.temperature}${c.heated ? ', heated' : ''}`],
      ['pH', c.phMin === null && c.phMax === null ? 'not given' : `${or(c.phMin)} to ${or(c.phMax)}`],
      ['Surface', sheetWords.turbulence[c.turbulence]],
      ['Debris and solids', sheetWords.solids[c.solids]],
      ['Chemicals or solvents present', or(c.chemicals)],
      ['Where the inflow enters', or(c.inflowAt)],
    ]),
    ...section('Oil', [
      ['Kind', sheetWords.oilKind[c.oilKind]],
      ['Specific gravity', String(c.oilSpecificGravity)],
      ['Free or emulsified', sheetWords.oilState[c.oilState]],
      ['Estimated oil load', or(c.estimatedOilLoad, u.load)],
      ['Where the oil gathers', or(c.oilGathersAt)],
    ]),
    ...section('Skimmer and supply', [
      ['Installed', `${equipment.ratedCapacity} ${equipment.ratedUnit}${equipment.mediumMaterial ? `, ${equipment.mediumMaterial}` : ''}`],
      ['Electrical supply', `${c.supplyVoltage ? `${c.supplyVoltage} V, ` : ''}${sheetWords.supplyPhase[c.supplyPhase]}`],
      ['Duty', c.duty === 'timed' ? `Timed, ${c.dutyHoursPerDay} h a day` : 'Continuous'],
      ['Notes', or(c.notes)],
    ]),
    { text: caution, fontSize: 8, color: '#444444', margin: [0, 14, 0, 0] },
  ];
  const definition: TDocumentDefinitions = {
    pageSize: 'LETTER',
    pageMargins: [48, 48, 48, 48],
    info: {
      title: `Application sheet, ${equipment.name}, version ${sheet.version}`,
      author: equipment.company,
      creator: 'Decant',
      producer: 'Decant',
    },
    content,
    defaultStyle: { fontSize: 9.5, lineHeight: 1.15 },
  };
  return renderPdf(definition);
}

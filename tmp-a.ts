import { parseAngle, formatDms } from './shared/angle/angle-text';
for (const t of ['7.5', "7°30'", '7°30', '7 30', '7d30m', '7d30m15', '14°30\'15"', "14°30'15''", '-7°30\'', '7:30:15', "30'", '15"', '7.5°', '7d', 'abc', '7 60', '', '1e5', "7° 30′ 15″", "1°60'", "- 3", "7 30 15 4", "7.5 30", "30' 7°", "7 deg 30 min", "7°30'x", "0.5'", ".5", "7.", "--3"]) {
  const r = parseAngle(t); console.log(JSON.stringify(t), r.ok ? r.degrees.toString() + ' ' + formatDms(r.degrees) : r.error);
}

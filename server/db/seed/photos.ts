import { Op } from 'sequelize';
import { Blanket } from '../models/blanket';
import { Photo } from '../models/photo';
import { loadSharp, preparePhoto, writePhoto } from '../../modules/photos/photo-files';
import { addSeedStep } from './demo';

/** Colour words the demo blankets use, as yarn shades. */
const SHADES: Record<string, string> = {
  mint: '#b9dcc6', cream: '#f3ead2', lemon: '#f4e38a', heather: '#9a86ad', oat: '#e2d5b9', rainbow: '#d9534f',
  teal: '#2f8f8a', orange: '#e58a3a', red: '#c0392b', yellow: '#f1c40f', sky: '#8fc1e3', blue: '#6a9fd1',
  sage: '#a9bf98', green: '#6b8e4e', charcoal: '#4a4a4f', silver: '#c4c7cc', lavender: '#b7a6d6', rose: '#d49aa4',
  forest: '#3f6b3a', white: '#f7f5ef', peach: '#f3c4a2', navy: '#2c3e66', mustard: '#d1a23a', rust: '#b5562f',
  'duck-egg': '#bfdcd6', buttermilk: '#f6ebbd', lilac: '#c9b3dc',
};
const FALLBACK = ['#9a86ad', '#e2d5b9', '#d1a23a', '#6b8e4e'];

export function shadesFor(colours: string): string[] {
  const words = colours.toLowerCase().split(/[^a-z-]+/);
  const found = words.flatMap((w) => (SHADES[w] ? [SHADES[w]] : []));
  return found.length >= 2 ? found : found.length === 1 ? [found[0]!, '#f3ead2'] : FALLBACK;
}

/** A picture of a crocheted blanket in its own colours: granny squares on a tabletop. */
export function blanketPictureSvg(colours: string, seed: number): string {
  const shades = shadesFor(colours);
  const cells: string[] = [];
  const n = 6;
  const size = 80;
  for (let r = 0; r < n; r++)
    for (let c = 0; c < n; c++) {
      const x = 60 + c * size;
      const y = 40 + r * size;
      const a = shades[(r + c + seed) % shades.length];
      const b = shades[(r * 2 + c + seed + 1) % shades.length];
      cells.push(
        `<rect x="${x}" y="${y}" width="${size - 4}" height="${size - 4}" rx="6" fill="${a}"/>` +
          `<rect x="${x + 16}" y="${y + 16}" width="${size - 36}" height="${size - 36}" rx="4" fill="${b}"/>` +
          `<circle cx="${x + size / 2 - 2}" cy="${y + size / 2 - 2}" r="7" fill="${a}" opacity="0.85"/>`,
      );
    }
  return `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="560" viewBox="0 0 600 560">
    <rect width="600" height="560" fill="#cdb89a"/>
    <rect x="44" y="24" width="512" height="512" rx="16" fill="${shades[0]}" opacity="0.55"/>
    ${cells.join('')}
  </svg>`;
}

/** One photo each for the demo blankets that have left the hook, so lists and pages show real thumbnails. */
addSeedStep(async (ctx) => {
  if (!ctx.uploadDir) return;
  const blankets = await Blanket.findAll({
    where: { status: { [Op.ne]: 'in_progress' } },
    order: [['id', 'ASC']],
    limit: 12,
    transaction: ctx.transaction,
  });
  const sharp = await loadSharp();
  for (const [i, b] of blankets.entries()) {
    const jpeg = await sharp(Buffer.from(blanketPictureSvg(b.colours, i))).jpeg({ quality: 80 }).toBuffer();
    const prepared = await preparePhoto({ originalname: 'blanket.jpg', size: jpeg.length, buffer: jpeg }, 0);
    const names = await writePhoto(ctx.uploadDir, prepared, []);
    await Photo.create(
      { blanketId: b.id, ...names, mime: prepared.mime, bytes: prepared.full.length, width: prepared.width, height: prepared.height },
      { transaction: ctx.transaction },
    );
  }
});

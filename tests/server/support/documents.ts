/** One small sample of each media type the evidence categories know, plus a renamed executable. */
import ExcelJS from 'exceljs';
import { Document, Packer, Paragraph } from 'docx';
import { MEDIA } from '../../../constants/schemas/evidence';
import { makePdf } from '../../../seeds/documents';

export interface Sample {
  mime: string;
  fileName: string;
  bytes: Buffer;
}

const PNG_1PX = 'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==';

export async function samples(): Promise<Sample[]> {
  const wb = new ExcelJS.Workbook();
  wb.addWorksheet('Tune-up').addRows([
    ['Band', 'Tune-up dBm'],
    ['Band 12', 24],
  ]);
  const docx = await Packer.toBuffer(new Document({ sections: [{ children: [new Paragraph('Keep the device 10 mm from the body.')] }] }));
  return [
    { mime: MEDIA.pdf, fileName: 'sample.pdf', bytes: await makePdf([['A sample document']]) },
    { mime: MEDIA.png, fileName: 'sample.png', bytes: Buffer.from(PNG_1PX, 'base64') },
    { mime: MEDIA.jpeg, fileName: 'sample.jpg', bytes: Buffer.from('ffd8ffe000104a46494600010100000100010000ffd9', 'hex') },
    { mime: MEDIA.tiff, fileName: 'sample.tif', bytes: Buffer.concat([Buffer.from('49492a0008000000', 'hex'), Buffer.alloc(64)]) },
    { mime: MEDIA.xlsx, fileName: 'sample.xlsx', bytes: Buffer.from(await wb.xlsx.writeBuffer()) },
    { mime: MEDIA.docx, fileName: 'sample.docx', bytes: Buffer.from(docx) },
    { mime: MEDIA.csv, fileName: 'sample.csv', bytes: Buffer.from('band,tune_up_dbm\nBand 12,24\n') },
    { mime: MEDIA.text, fileName: 'sample.txt', bytes: Buffer.from('Notes on the setup.\n') },
  ];
}

/** A Windows executable's first bytes, named like a PDF. */
export const renamedExecutable = (): Sample => ({
  mime: 'application/x-msdownload',
  fileName: 'test-report.pdf',
  bytes: Buffer.concat([Buffer.from('4d5a90000300000004000000ffff0000b800000000000000400000000000000000000000', 'hex'), Buffer.alloc(200)]),
});

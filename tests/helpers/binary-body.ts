/** A supertest parser that keeps a response's body as bytes (a PDF, a workbook, a ZIP). */
export const binary = (res: NodeJS.ReadableStream, done: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => done(null, Buffer.concat(chunks)));
};

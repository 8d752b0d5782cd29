import { MAX_PHOTO_BYTES, PhotoRejected, storePhoto } from '@/lib/storage';
import { AppError, invalid, tooLarge, unsupported } from '@/lib/server/errors';
import { json } from '@/lib/server/http';
import { route } from '@/lib/server/route';
import { BodyTooLargeError, readBodyLimited } from '@/lib/security/limits';

/** Room for the multipart envelope around a 10 MB file. */
const MAX_BODY = MAX_PHOTO_BYTES + 64 * 1024;
const onFile = (e: AppError, message: string) => new AppError(e.kind, e.code, e.message, { fields: { file: message } });

/** `POST /api/uploads`: multipart `file`, an image of at most 10 MB → 201 `{ photoKey }`. */
export const POST = route(
  async ({ ctx, req }) => {
    if (!(req.headers.get('content-type') ?? '').startsWith('multipart/form-data')) {
      throw onFile(unsupported('Send the photo as multipart form data in the field "file".'), 'Choose a photo.');
    }
    let bytes: Uint8Array;
    try {
      // Refused by its Content-Length, or while it arrives when it comes in chunks without one.
      bytes = await readBodyLimited(req, MAX_BODY);
    } catch (err) {
      if (err instanceof BodyTooLargeError) throw onFile(tooLarge('The photo is larger than 10 MB.'), 'The photo is larger than 10 MB.');
      throw err;
    }
    let file: FormDataEntryValue | null;
    try {
      const form = new Response(bytes as BodyInit, { headers: { 'content-type': req.headers.get('content-type') ?? '' } });
      file = (await form.formData()).get('file');
    } catch {
      throw new AppError('bad_request', 'unreadable_upload', 'The upload could not be read; try again.', { fields: { file: 'Choose a photo.' } });
    }
    if (!file || typeof file === 'string') throw invalid('Choose a photo.', { file: 'Choose a photo.' });
    if (file.size > MAX_PHOTO_BYTES) throw onFile(tooLarge('The photo is larger than 10 MB.'), 'The photo is larger than 10 MB.');
    try {
      return json({ photoKey: await storePhoto({ cooperativeId: ctx.cooperativeId, bytes: new Uint8Array(await file.arrayBuffer()) }) }, 201);
    } catch (err) {
      if (!(err instanceof PhotoRejected)) throw err;
      const e = err.reason === 'too-large' ? tooLarge(err.message) : err.reason === 'empty' ? invalid(err.message) : unsupported(err.message, 'not_an_image');
      throw onFile(e, err.message);
    }
  },
  { roles: ['sugarmaker', 'coordinator'] },
);

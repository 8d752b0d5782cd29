import { NextResponse } from 'next/server';
import { requireUser } from '@/lib/auth/session';
import { ApiError, route } from '@/lib/api/errors';
import { MAX_PHOTO_BYTES, PhotoRejected, storePhoto } from '@/lib/storage';

/** Room for the multipart envelope around a 10 MB file. */
const MAX_BODY = MAX_PHOTO_BYTES + 64 * 1024;

/** `POST /api/uploads`: multipart `file`, an image of at most 10 MB → 201 `{ photoKey }`. */
export const POST = route(async (req) => {
  const user = await requireUser();
  if (user.role !== 'coordinator' && user.role !== 'sugarmaker') {
    throw new ApiError(403, 'Only a sugarmaker or a coordinator can attach photos.', undefined, { code: 'forbidden' });
  }
  const length = Number(req.headers.get('content-length') ?? NaN);
  if (Number.isFinite(length) && length > MAX_BODY) {
    throw new ApiError(413, 'The photo is larger than 10 MB.', { file: 'The photo is larger than 10 MB.' }, { code: 'too_large' });
  }
  if (!(req.headers.get('content-type') ?? '').startsWith('multipart/form-data')) {
    throw new ApiError(415, 'Send the photo as multipart form data in the field "file".', { file: 'Choose a photo.' }, { code: 'unsupported_type' });
  }
  let file: FormDataEntryValue | null;
  try {
    file = (await req.formData()).get('file');
  } catch {
    throw new ApiError(400, 'The upload could not be read; try again.', { file: 'Choose a photo.' }, { code: 'invalid_input' });
  }
  if (!file || typeof file === 'string') throw new ApiError(422, 'Choose a photo.', { file: 'Choose a photo.' }, { code: 'invalid_input' });
  if (file.size > MAX_PHOTO_BYTES) throw new ApiError(413, 'The photo is larger than 10 MB.', { file: 'The photo is larger than 10 MB.' }, { code: 'too_large' });
  try {
    const photoKey = await storePhoto({ cooperativeId: user.cooperativeId, bytes: new Uint8Array(await file.arrayBuffer()) });
    return NextResponse.json({ photoKey }, { status: 201 });
  } catch (err) {
    if (err instanceof PhotoRejected) {
      const status = err.reason === 'too-large' ? 413 : err.reason === 'empty' ? 422 : 415;
      const code = err.reason === 'too-large' ? 'too_large' : err.reason === 'empty' ? 'invalid_input' : 'unsupported_type';
      throw new ApiError(status, err.message, { file: err.message }, { code });
    }
    throw err;
  }
});

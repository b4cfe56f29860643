import type { Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import type { CompanyProfile as ProfileView, CompanyProfileInput } from '../../shared/api/api-schemas';
import { currentUser } from '../accounts/authenticated-user';
import { checkedName } from '../api/checked-text';
import { ProblemError } from '../api/problem-details';
import { CompanyProfile } from '../database/models';
import { checkedLogo, LOGO_LIMITS, LogoRefusal } from './logo-image';

/*
 * A designer's company profile, which heads every proposal they make: contact lines and a logo.
 * The logo is held in memory (at most 1 MiB) and written only once its bytes are checked.
 */

const emptyProfile = { name: '', address: '', phone: '', email: '', licenceNumber: '' };

export function profileView(profile: CompanyProfile | null): ProfileView {
  if (!profile) return { ...emptyProfile, logo: null, updatedAt: null };
  return {
    name: profile.name,
    address: profile.address,
    phone: profile.phone,
    email: profile.email,
    licenceNumber: profile.licenceNumber,
    logo:
      profile.logo && profile.logoType && profile.logoWidth && profile.logoHeight
        ? {
            type: profile.logoType,
            width: profile.logoWidth,
            height: profile.logoHeight,
            byteLength: profile.logo.length,
          }
        : null,
    updatedAt: profile.updatedAt.toISOString(),
  };
}

/** Empty, or visible text under the shared rule for typed names (each line of a multi-line field). */
export function optionalText(text: string, pointer: string): string {
  return text
    .split('\n')
    .map((line) => (line.trim() === '' ? '' : checkedName(line, pointer)))
    .join('\n')
    .trim();
}

function checkedProfile(body: CompanyProfileInput): CompanyProfileInput {
  return {
    name: optionalText(body.name, '/body/name'),
    address: optionalText(body.address, '/body/address'),
    phone: body.phone.trim(),
    email: body.email.trim(),
    licenceNumber: optionalText(body.licenceNumber, '/body/licenceNumber'),
  };
}

function receiveLogo(request: Request, response: Response): Promise<Buffer> {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: LOGO_LIMITS.maxBytes, files: 1, fields: 0, parts: 1 },
  }).single('file');
  return new Promise((resolve, reject) => {
    upload(request, response, (error: unknown) => {
      if (error instanceof multer.MulterError && error.code === 'LIMIT_FILE_SIZE')
        return reject(
          new ProblemError(413, 'File too large', `A logo is at most ${LOGO_LIMITS.maxBytes} bytes (1 MiB)`, [
            { pointer: '/body/file', detail: `at most ${LOGO_LIMITS.maxBytes} bytes` },
          ]),
        );
      if (error)
        return reject(
          new ProblemError(
            400,
            'Invalid upload',
            'Send one PNG or JPEG file in the multipart field "file"',
            [{ pointer: '/body/file', detail: error instanceof Error ? error.message : 'unreadable body' }],
            'invalid-request',
          ),
        );
      if (!request.file)
        return reject(
          new ProblemError(400, 'Invalid upload', 'Send one PNG or JPEG file in the multipart field "file"', [
            { pointer: '/body/file', detail: 'is required' },
          ]),
        );
      resolve(request.file.buffer);
    });
  });
}

export function createProfileHandlers(): Record<
  'getCompanyProfile' | 'updateCompanyProfile' | 'getCompanyLogo' | 'uploadCompanyLogo',
  RequestHandler
> {
  return {
    getCompanyProfile: async (request, response) => {
      response.json(profileView(await CompanyProfile.findByPk(currentUser(request).id)));
    },

    updateCompanyProfile: async (request, response) => {
      const input = checkedProfile(request.body as CompanyProfileInput);
      const userId = currentUser(request).id;
      const existing = await CompanyProfile.findByPk(userId);
      const profile = existing
        ? await existing.update(input)
        : await CompanyProfile.create({
            userId,
            ...input,
            logo: null,
            logoType: null,
            logoWidth: null,
            logoHeight: null,
          });
      response.json(profileView(profile));
    },

    getCompanyLogo: async (request, response) => {
      const profile = await CompanyProfile.findByPk(currentUser(request).id);
      if (!profile?.logo || !profile.logoType)
        throw new ProblemError(404, 'Not found', 'Your company profile has no logo yet');
      response.type(profile.logoType).set('Cache-Control', 'private, no-cache').send(profile.logo);
    },

    uploadCompanyLogo: async (request, response) => {
      if (!request.is('multipart/form-data'))
        throw new ProblemError(415, 'Unsupported media type', 'Send the logo as multipart/form-data', [
          { pointer: '/body/file', detail: 'send multipart/form-data with the field "file"' },
        ]);
      const bytes = await receiveLogo(request, response);
      let logo;
      try {
        logo = checkedLogo(bytes);
      } catch (error) {
        if (!(error instanceof LogoRefusal)) throw error;
        throw error.kind === 'unsupported'
          ? new ProblemError(415, 'Unsupported image type', `A logo is a PNG or JPEG image: ${error.message}`, [
              { pointer: '/body/file', detail: 'must be a PNG or JPEG image' },
            ])
          : new ProblemError(422, 'Invalid image', `The logo cannot be used: ${error.message}`, [
              { pointer: '/body/file', detail: error.message },
            ]);
      }
      const userId = currentUser(request).id;
      const fields = { logo: bytes, logoType: logo.type, logoWidth: logo.width, logoHeight: logo.height };
      const existing = await CompanyProfile.findByPk(userId);
      const profile = existing
        ? await existing.update(fields)
        : await CompanyProfile.create({ userId, ...emptyProfile, ...fields });
      response.json(profileView(profile));
    },
  };
}

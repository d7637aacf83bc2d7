import { certificateContentTypes, sdsContentTypes, type Chemical, type Lot } from '@lotwise/shared';
import { AppError } from '../../lib/app-error';
import type { FileStore } from '../../lib/uploads';
import type { Store } from '../../db/store';
import { nowIso } from '../../db/sql';

/**
 * The safety data sheet of a chemical and the certificate of analysis of a lot. One file
 * each: uploading again replaces it (the old file is removed once the new one is recorded).
 */
export function uploadsService(store: Store, files: FileStore) {
  async function chemicalRow(id: number) {
    const row = await store.repos.chemicals.findRow(id);
    if (!row) throw AppError.notFound(`There is no chemical #${id}.`);
    return row;
  }
  async function lotRow(id: number) {
    const row = await store.repos.lots.findRow(id);
    if (!row) throw AppError.notFound(`There is no lot #${id}.`);
    return row;
  }

  return {
    async putSds(chemicalId: number, upload: Express.Multer.File): Promise<Chemical> {
      const kept = await files.keep(upload, sdsContentTypes, 'A safety data sheet', 'sds.pdf');
      try {
        const { chemical, old } = await store.transaction(async (repos) => {
          const row = await repos.chemicals.findRow(chemicalId);
          if (!row) throw AppError.notFound(`There is no chemical #${chemicalId}.`);
          const chemical = await repos.chemicals.update(chemicalId, {
            sdsFileName: kept.fileName,
            sdsStoredName: kept.storedName,
            sdsSize: kept.size,
            sdsContentType: kept.contentType,
            sdsUploadedAt: nowIso(),
          });
          return { chemical, old: row.sdsStoredName };
        });
        await files.remove(old);
        return chemical;
      } catch (error) {
        await files.remove(kept.storedName);
        throw error;
      }
    },

    async sds(chemicalId: number) {
      const row = await chemicalRow(chemicalId);
      if (!row.sdsStoredName || !row.sdsFileName) {
        throw AppError.notFound(`${row.name} has no safety data sheet in Lotwise yet.`);
      }
      return {
        what: `the safety data sheet of ${row.name}`,
        storedName: row.sdsStoredName,
        fileName: row.sdsFileName,
        contentType: row.sdsContentType ?? 'application/pdf',
      };
    },

    async removeSds(chemicalId: number): Promise<void> {
      const old = await store.transaction(async (repos) => {
        const row = await repos.chemicals.findRow(chemicalId);
        if (!row) throw AppError.notFound(`There is no chemical #${chemicalId}.`);
        if (!row.sdsStoredName) {
          throw AppError.notFound(`${row.name} has no safety data sheet in Lotwise.`);
        }
        await repos.chemicals.update(chemicalId, {
          sdsFileName: null,
          sdsStoredName: null,
          sdsSize: null,
          sdsContentType: null,
          sdsUploadedAt: null,
        });
        return row.sdsStoredName;
      });
      await files.remove(old);
    },

    async putCertificate(lotId: number, upload: Express.Multer.File): Promise<Lot> {
      const kept = await files.keep(
        upload,
        certificateContentTypes,
        'A certificate of analysis',
        'certificate.pdf',
      );
      try {
        const { lot, old } = await store.transaction(async (repos) => {
          const row = await repos.lots.findRow(lotId);
          if (!row) throw AppError.notFound(`There is no lot #${lotId}.`);
          await repos.lots.update(lotId, {
            certificateFileName: kept.fileName,
            certificateStoredName: kept.storedName,
            certificateSize: kept.size,
            certificateContentType: kept.contentType,
            certificateUploadedAt: nowIso(),
          });
          return { lot: (await repos.lots.findById(lotId))!, old: row.certificateStoredName };
        });
        await files.remove(old);
        return lot;
      } catch (error) {
        await files.remove(kept.storedName);
        throw error;
      }
    },

    async certificate(lotId: number) {
      const row = await lotRow(lotId);
      if (!row.certificateStoredName || !row.certificateFileName) {
        throw AppError.notFound(`Lot #${lotId} has no certificate of analysis in Lotwise yet.`);
      }
      return {
        what: `the certificate of lot #${lotId}`,
        storedName: row.certificateStoredName,
        fileName: row.certificateFileName,
        contentType: row.certificateContentType ?? 'application/pdf',
      };
    },

    async removeCertificate(lotId: number): Promise<void> {
      const old = await store.transaction(async (repos) => {
        const row = await repos.lots.findRow(lotId);
        if (!row) throw AppError.notFound(`There is no lot #${lotId}.`);
        if (!row.certificateStoredName) {
          throw AppError.notFound(`Lot #${lotId} has no certificate of analysis in Lotwise.`);
        }
        await repos.lots.update(lotId, {
          certificateFileName: null,
          certificateStoredName: null,
          certificateSize: null,
          certificateContentType: null,
          certificateUploadedAt: null,
        });
        return row.certificateStoredName;
      });
      await files.remove(old);
    },
  };
}
export type UploadsService = ReturnType<typeof uploadsService>;

// Original uploads, kept byte for byte beside the revision they produced.
import type { Knex } from "knex";

export interface ModelFile {
  fileName: string;
  mediaType: string;
  bytes: Buffer;
  sizeBytes: number;
}

export async function insertModelFile(trx: Knex, revisionId: string, file: ModelFile): Promise<void> {
  await trx("model_files").insert({
    revision_id: revisionId,
    file_name: file.fileName,
    media_type: file.mediaType,
    bytes: file.bytes,
    size_bytes: file.sizeBytes,
  });
}

export async function findModelFile(db: Knex, revisionId: string): Promise<ModelFile | null> {
  const row = (await db("model_files")
    .where({ revision_id: revisionId })
    .first("file_name", "media_type", "bytes", "size_bytes")) as
    { file_name: string; media_type: string; bytes: Buffer; size_bytes: number } | undefined;
  return row
    ? { fileName: row.file_name, mediaType: row.media_type, bytes: row.bytes, sizeBytes: row.size_bytes }
    : null;
}

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type UploadChunkPart = 'raw' | 'series';

/** A piece (≤ CHUNK_BYTES) of an upload's raw file or parsed series; read back in `seq` order. */
export class UploadChunk extends Model<InferAttributes<UploadChunk>, InferCreationAttributes<UploadChunk>> {
  declare id: CreationOptional<number>;
  declare uploadId: number;
  declare part: UploadChunkPart;
  declare seq: number;
  declare data: Buffer;
}

/** Below MariaDB's default max_allowed_packet (16 MB) with room for the statement. */
export const CHUNK_BYTES = 4 * 1024 * 1024;

export function defineUploadChunk(sequelize: Sequelize) {
  UploadChunk.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      uploadId: { type: DataTypes.INTEGER, allowNull: false },
      part: { type: DataTypes.ENUM('raw', 'series'), allowNull: false },
      seq: { type: DataTypes.INTEGER, allowNull: false },
      data: { type: DataTypes.BLOB('medium'), allowNull: false },
    },
    { sequelize, tableName: 'upload_chunks', modelName: 'UploadChunk', timestamps: false },
  );
  return UploadChunk;
}

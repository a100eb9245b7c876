import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type UploadKind = 'run-log' | 'dsc' | 'dma' | 'other';

export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare kind: UploadKind;
  declare fileName: string;
  declare mimeType: string;
  declare sizeBytes: number;
  declare checksumSha256: string;
  declare parsed: unknown;
  declare uploadedBy: number | null;
  declare studyId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineUpload(sequelize: Sequelize) {
  Upload.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.ENUM('run-log', 'dsc', 'dma', 'other'), allowNull: false },
      fileName: { type: DataTypes.STRING(255), allowNull: false },
      mimeType: { type: DataTypes.STRING(120), allowNull: false },
      sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
      checksumSha256: { type: DataTypes.CHAR(64), allowNull: false },
      parsed: { type: DataTypes.JSON, allowNull: true },
      uploadedBy: { type: DataTypes.INTEGER, allowNull: true },
      studyId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'uploads', modelName: 'Upload' },
  );
  return Upload;
}

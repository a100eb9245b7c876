import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export class Material extends Model<InferAttributes<Material>, InferCreationAttributes<Material>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare kind: 'resin' | 'ply';
  declare name: string;
  declare params: unknown;
  declare provenance: unknown;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineMaterial(sequelize: Sequelize) {
  Material.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.ENUM('resin', 'ply'), allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      params: { type: DataTypes.JSON, allowNull: false },
      provenance: { type: DataTypes.JSON, allowNull: true },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'materials', modelName: 'Material' },
  );
  return Material;
}

import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type ReviewDecision = 'use-as-is' | 'rework' | 'scrap';

export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<number>;
  declare teamId: number;
  declare uploadId: number;
  declare decision: ReviewDecision;
  declare rationale: string;
  declare decidedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function defineReview(sequelize: Sequelize) {
  Review.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      teamId: { type: DataTypes.INTEGER, allowNull: false },
      uploadId: { type: DataTypes.INTEGER, allowNull: false },
      decision: { type: DataTypes.ENUM('use-as-is', 'rework', 'scrap'), allowNull: false },
      rationale: { type: DataTypes.TEXT, allowNull: false },
      decidedBy: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'reviews', modelName: 'Review' },
  );
  return Review;
}

/**
 * Column definitions that carry the TypeScript type of their value, so a model writes each field once:
 * its attribute types are read off its column object (`Fields`) instead of a second list of declarations.
 */
import { DataTypes, type CreationOptional, type DataType, type ModelAttributeColumnOptions } from "sequelize";

declare const valueType: unique symbol;
export type Column<T> = ModelAttributeColumnOptions & { readonly [valueType]?: T };

/** The attribute types of a column object, which a model's interface extends. */
export type Fields<C> = { [K in keyof C]: C[K] extends Column<infer T> ? T : never };

/** Any column, typed by hand: keys, unique columns and other options the helpers below do not cover. */
export const column = <T>(options: ModelAttributeColumnOptions): Column<T> => options;
/** NOT NULL. */
export const required = <T>(type: DataType): Column<T> => ({ type, allowNull: false });
/** Nullable; an insert may leave it out. */
export const optional = <T>(type: DataType): Column<T | null> => ({ type, allowNull: true });
/** NOT NULL with a default, so an insert may leave it out. */
export const defaulted = <T>(type: DataType, defaultValue: T): Column<CreationOptional<T>> => ({ type, allowNull: false, defaultValue });

export const id: Column<CreationOptional<number>> = { type: DataTypes.INTEGER, primaryKey: true, autoIncrement: true };
/** Millisecond timestamps, which keep the order of events exact. */
export const createdAt: Column<CreationOptional<Date>> = { type: DataTypes.DATE(3) };
export const updatedAt: Column<CreationOptional<Date>> = { type: DataTypes.DATE(3) };
export const timestamps = { createdAt, updatedAt };

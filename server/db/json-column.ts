/** A JSON column from a raw query: the driver gives it as text, Sequelize's model reads give it parsed; either way, the value. */
export const jsonColumn = <T>(v: string | T): T => (typeof v === "string" ? (JSON.parse(v) as T) : v);

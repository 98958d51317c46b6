import { Text, View } from "@react-pdf/renderer";
import { base } from "./styles.ts";

/** The line at the foot of every page: what the document is, and page n of N. */
export function PageFooter({ label }: { label: string }) {
  return (
    <View style={base.footer} fixed>
      <Text>{label}</Text>
      <Text render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages}`} />
    </View>
  );
}

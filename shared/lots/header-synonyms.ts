/**
 * How laboratories name parameters in their exports, in English, French, Italian, Spanish, German
 * and Portuguese. Keys are folded as `foldHeader` folds them (lower case, no accents, single
 * spaces), so "Acidité volatile", "ACIDITE VOLATILE" and "acidite  volatile" all match.
 * The wording is the trade's usual wording (common practice); add a name here, never in a component.
 */
export type HeaderLanguage = "en" | "fr" | "it" | "es" | "de" | "pt";

export const HEADER_SYNONYMS: Record<string, Partial<Record<HeaderLanguage, readonly string[]>>> = {
  free_so2: {
    en: ["free so2", "so2 free", "free sulphur dioxide", "free sulfur dioxide", "fso2", "free so2 (fso2)"],
    fr: ["so2 libre", "anhydride sulfureux libre", "dioxyde de soufre libre"],
    it: ["so2 libera", "anidride solforosa libera"],
    es: ["so2 libre", "anhidrido sulfuroso libre", "dioxido de azufre libre"],
    de: ["freie so2", "freies so2", "so2 frei", "freie schweflige saure", "freie schweflige saeure"],
    pt: ["so2 livre", "dioxido de enxofre livre", "anidrido sulfuroso livre"],
  },
  total_so2: {
    en: ["total so2", "so2 total", "total sulphur dioxide", "total sulfur dioxide", "tso2"],
    fr: ["so2 total", "anhydride sulfureux total", "dioxyde de soufre total"],
    it: ["so2 totale", "anidride solforosa totale"],
    es: ["so2 total", "anhidrido sulfuroso total", "dioxido de azufre total"],
    de: ["gesamt so2", "gesamt-so2", "so2 gesamt", "gesamte schweflige saure", "gesamte schweflige saeure", "gesamtschweflige saure"],
    pt: ["so2 total", "dioxido de enxofre total", "anidrido sulfuroso total"],
  },
  volatile_acidity: {
    en: ["volatile acidity", "va", "volatile acid", "volatile acids"],
    fr: ["acidite volatile", "av"],
    it: ["acidita volatile", "av"],
    es: ["acidez volatil", "av"],
    de: ["fluchtige saure", "fluechtige saeure", "fluchtige sauren"],
    pt: ["acidez volatil", "av"],
  },
  total_acidity: {
    en: ["total acidity", "ta", "titratable acidity"],
    fr: ["acidite totale", "at", "acidite titrable"],
    it: ["acidita totale", "acidita titolabile", "at"],
    es: ["acidez total", "acidez titulable", "at"],
    de: ["gesamtsaure", "gesamtsaeure", "titrierbare saure", "titrierbare gesamtsaure"],
    pt: ["acidez total", "acidez titulavel"],
  },
  alcohol: {
    en: ["alcohol", "abv", "alcoholic strength", "actual alcohol", "alcohol by volume", "actual alcoholic strength"],
    fr: ["titre alcoometrique", "titre alcoometrique volumique", "tav", "tav acquis", "alcool", "degre alcoolique"],
    it: ["titolo alcolometrico", "titolo alcolometrico volumico", "titolo alcolometrico effettivo", "alcol", "grado alcolico"],
    es: ["grado alcoholico", "graduacion alcoholica", "grado alcoholico volumico", "alcohol adquirido"],
    de: ["alkohol", "vorhandener alkohol", "alkoholgehalt", "vorhandener alkoholgehalt"],
    pt: ["titulo alcoometrico", "titulo alcoometrico volumico", "teor alcoolico", "alcool", "grau alcoolico"],
  },
  residual_sugar: {
    en: ["residual sugar", "rs", "glucose+fructose", "glucose + fructose", "sugars"],
    fr: ["sucres residuels", "sucre residuel", "sucres", "glucose + fructose", "glucose+fructose"],
    it: ["zuccheri residui", "zucchero residuo", "zuccheri riduttori", "glucosio + fruttosio"],
    es: ["azucares residuales", "azucar residual", "azucares reductores", "glucosa + fructosa"],
    de: ["restzucker", "glucose + fructose", "glukose + fruktose"],
    pt: ["acucares residuais", "acucar residual", "acucares redutores", "glicose + frutose"],
  },
  ph: { en: ["ph"], fr: ["ph"], it: ["ph"], es: ["ph"], de: ["ph", "ph-wert"], pt: ["ph"] },
  malic_acid: {
    en: ["malic acid", "malic"],
    fr: ["acide malique"],
    it: ["acido malico"],
    es: ["acido malico"],
    de: ["apfelsaure", "aepfelsaeure"],
    pt: ["acido malico"],
  },
  lactic_acid: {
    en: ["lactic acid", "lactic"],
    fr: ["acide lactique"],
    it: ["acido lattico"],
    es: ["acido lactico"],
    de: ["milchsaure", "milchsaeure"],
    pt: ["acido latico", "acido lactico"],
  },
  citric_acid: {
    en: ["citric acid", "citric"],
    fr: ["acide citrique"],
    it: ["acido citrico"],
    es: ["acido citrico"],
    de: ["citronensaure", "zitronensaure"],
    pt: ["acido citrico"],
  },
  sorbic_acid: {
    en: ["sorbic acid", "sorbic"],
    fr: ["acide sorbique"],
    it: ["acido sorbico"],
    es: ["acido sorbico"],
    de: ["sorbinsaure", "sorbinsaeure"],
    pt: ["acido sorbico"],
  },
  density: {
    en: ["density", "density at 20 c", "relative density"],
    fr: ["densite", "masse volumique"],
    it: ["densita", "massa volumica"],
    es: ["densidad", "masa volumica"],
    de: ["dichte", "relative dichte"],
    pt: ["densidade", "massa volumica"],
  },
  total_dry_extract: {
    en: ["total dry extract", "dry extract", "total extract"],
    fr: ["extrait sec total", "extrait sec"],
    it: ["estratto secco totale", "estratto secco"],
    es: ["extracto seco total", "extracto seco"],
    de: ["gesamtextrakt", "extrakt"],
    pt: ["extrato seco total", "extracto seco total"],
  },
  heat_test_haze: {
    en: ["heat test", "heat stability", "protein stability", "heat test haze"],
    fr: ["stabilite proteique", "test a la chaleur"],
    it: ["stabilita proteica", "prova al calore"],
    es: ["estabilidad proteica", "prueba de calor"],
    de: ["eiweissstabilitat", "eiweisstest", "warmetest"],
    pt: ["estabilidade proteica", "teste de calor"],
  },
  turbidity: {
    en: ["turbidity"],
    fr: ["turbidite"],
    it: ["torbidita"],
    es: ["turbidez", "turbiedad"],
    de: ["trubung", "truebung"],
    pt: ["turbidez"],
  },
  iron: { en: ["iron", "fe"], fr: ["fer"], it: ["ferro"], es: ["hierro"], de: ["eisen"], pt: ["ferro"] },
  copper: { en: ["copper", "cu"], fr: ["cuivre"], it: ["rame"], es: ["cobre"], de: ["kupfer"], pt: ["cobre"] },
  lead: { en: ["lead", "pb"], fr: ["plomb"], it: ["piombo"], es: ["plomo"], de: ["blei"], pt: ["chumbo"] },
  dissolved_oxygen: {
    en: ["dissolved oxygen", "do", "o2", "dissolved o2"],
    fr: ["oxygene dissous", "o2 dissous"],
    it: ["ossigeno disciolto"],
    es: ["oxigeno disuelto"],
    de: ["geloster sauerstoff", "geloester sauerstoff", "sauerstoff"],
    pt: ["oxigenio dissolvido"],
  },
  carbon_dioxide: {
    en: ["carbon dioxide", "co2", "dissolved co2"],
    fr: ["dioxyde de carbone", "gaz carbonique", "co2 dissous"],
    it: ["anidride carbonica"],
    es: ["dioxido de carbono", "anhidrido carbonico"],
    de: ["kohlendioxid", "kohlensaure"],
    pt: ["dioxido de carbono", "gas carbonico"],
  },
  methanol: { en: ["methanol"], fr: ["methanol"], it: ["metanolo"], es: ["metanol"], de: ["methanol"], pt: ["metanol"] },
  tca: {
    en: ["tca", "trichloroanisole", "2,4,6-tca", "2,4,6-trichloroanisole"],
    fr: ["trichloroanisole"],
    it: ["tricloroanisolo"],
    es: ["tricloroanisol"],
    de: ["trichloranisol"],
    pt: ["tricloroanisol"],
  },
  ethylphenol_4: {
    en: ["4-ep", "4-ethylphenol"],
    fr: ["4-ethylphenol"],
    it: ["4-etilfenolo"],
    es: ["4-etilfenol"],
    de: ["4-ethylphenol"],
    pt: ["4-etilfenol"],
  },
  ethylguaiacol_4: {
    en: ["4-eg", "4-ethylguaiacol"],
    fr: ["4-ethylgaiacol"],
    it: ["4-etilguaiacolo"],
    es: ["4-etilguayacol"],
    de: ["4-ethylguajakol"],
    pt: ["4-etilguaiacol"],
  },
  ochratoxin_a: {
    en: ["ochratoxin a", "ota"],
    fr: ["ochratoxine a"],
    it: ["ocratossina a"],
    es: ["ocratoxina a"],
    de: ["ochratoxin a"],
    pt: ["ocratoxina a"],
  },
  arsenic: { en: ["arsenic", "as"], fr: ["arsenic"], it: ["arsenico"], es: ["arsenico"], de: ["arsen"], pt: ["arsenio"] },
  cadmium: { en: ["cadmium", "cd"], fr: ["cadmium"], it: ["cadmio"], es: ["cadmio"], de: ["cadmium", "kadmium"], pt: ["cadmio"] },
  boron: { en: ["boron", "boric acid"], fr: ["bore"], it: ["boro"], es: ["boro"], de: ["bor"], pt: ["boro"] },
  bromine: { en: ["bromine", "bromide"], fr: ["brome", "bromure"], it: ["bromo"], es: ["bromo"], de: ["brom"], pt: ["bromo"] },
  excess_sodium: {
    en: ["excess sodium"],
    fr: ["sodium en exces"],
    it: ["sodio in eccesso"],
    es: ["sodio en exceso"],
    de: ["natriumuberschuss", "uberschussiges natrium"],
    pt: ["sodio em excesso"],
  },
  sulphates: {
    en: ["sulphates", "sulfates", "potassium sulphate"],
    fr: ["sulfates"],
    it: ["solfati"],
    es: ["sulfatos"],
    de: ["sulfate", "sulfat"],
    pt: ["sulfatos"],
  },
  overpressure: {
    en: ["overpressure", "pressure", "co2 pressure"],
    fr: ["surpression", "pression"],
    it: ["sovrappressione", "pressione"],
    es: ["sobrepresion", "presion"],
    de: ["uberdruck", "druck"],
    pt: ["sobrepressao", "pressao"],
  },
  silver: { en: ["silver", "ag"], fr: ["argent"], it: ["argento"], es: ["plata"], de: ["silber"], pt: ["prata"] },
  fluoride: {
    en: ["fluoride", "fluorides"],
    fr: ["fluorures", "fluor"],
    it: ["fluoruri", "fluoro"],
    es: ["fluoruros", "fluor"],
    de: ["fluorid"],
    pt: ["fluoretos", "fluor"],
  },
  diethylene_glycol: {
    en: ["diethylene glycol", "deg"],
    fr: ["diethylene glycol"],
    it: ["glicole dietilenico"],
    es: ["dietilenglicol"],
    de: ["diethylenglykol"],
    pt: ["dietilenoglicol"],
  },
  ethylene_glycol: {
    en: ["ethylene glycol", "ethanediol"],
    fr: ["ethylene glycol", "ethanediol"],
    it: ["glicole etilenico"],
    es: ["etilenglicol"],
    de: ["ethylenglykol"],
    pt: ["etilenoglicol"],
  },
  propylene_glycol: {
    en: ["propylene glycol", "propan-1,2-diol", "1,2-propanediol"],
    fr: ["propylene glycol", "propane-1,2-diol"],
    it: ["glicole propilenico"],
    es: ["propilenglicol"],
    de: ["propylenglykol"],
    pt: ["propilenoglicol"],
  },
  malvidin_diglucoside: {
    en: ["malvidin diglucoside", "malvidol diglucoside"],
    fr: ["diglucoside de malvidine", "malvidine diglucoside"],
    it: ["malvidina diglucoside"],
    es: ["diglucosido de malvidina"],
    de: ["malvidin-diglucosid", "malvidindiglucosid"],
    pt: ["diglucosido de malvidina"],
  },
  ethyl_carbamate: {
    en: ["ethyl carbamate", "urethane"],
    fr: ["carbamate d'ethyle"],
    it: ["carbammato di etile", "etilcarbammato"],
    es: ["carbamato de etilo"],
    de: ["ethylcarbamat"],
    pt: ["carbamato de etilo"],
  },
  yeast_count: {
    en: ["yeast", "yeasts", "yeast count"],
    fr: ["levures"],
    it: ["lieviti"],
    es: ["levaduras"],
    de: ["hefen", "hefezahl"],
    pt: ["leveduras"],
  },
  bacteria_count: {
    en: ["bacteria", "bacteria count"],
    fr: ["bacteries"],
    it: ["batteri"],
    es: ["bacterias"],
    de: ["bakterien"],
    pt: ["bacterias"],
  },
};

/** Lower case, accents and the subscript ₂ folded, single spaces: the form the table's keys are written in. */
export function foldHeader(text: string): string {
  return text
    .normalize("NFD")
    .replace(/\p{Diacritic}/gu, "")
    .replace(/₂/g, "2")
    .replace(/ß/g, "ss")
    .toLowerCase()
    .replace(/\s+/g, " ")
    .trim();
}

const INDEX = new Map<string, string>();
for (const [parameter, byLanguage] of Object.entries(HEADER_SYNONYMS)) {
  for (const names of Object.values(byLanguage)) for (const n of names) if (!INDEX.has(foldHeader(n))) INDEX.set(foldHeader(n), parameter);
}

/** The parameter a header names, in any of the six languages; null when none. */
export const parameterForHeaderName = (name: string): string | null => INDEX.get(foldHeader(name)) ?? null;

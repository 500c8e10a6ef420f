/**
 * @module product/citations
 * The documents the product catalogue's numbers were read in, one constant per document, each naming the part
 * that was read (most often the abstract: the numbers taken from a document are the ones its read part states).
 * A document whose authors or year were not shown on the copy read says so; such a document can back a
 * `transcribed` or `memory` number, never a `published` one.
 */

// Grapes and raisins
export const DOYMAZ_2012 =
  'Doymaz I. 2012, Sun drying of seedless and seeded grapes, J. Food Sci. Technol. 49(2):214–220, doi:10.1007/s13197-011-0272-9 (abstract)'
export const ESMAIILI_2014 =
  'Esmaiili Bazardeh M., Esmaiili M. 2014, Sorption isotherm and state diagram in evaluating storage stability for sultana raisins, J. Stored Prod. Res. 59:140–145 (abstract)'
export const USDA_RAISIN_GRADES =
  'USDA Agricultural Marketing Service 1976 (as amended), United States Standards for Grades of Processed Raisins, 7 CFR §52.1855 and §52.1858 (41 FR 34751, Aug. 17, 1976)'

// Water activity
export const BEUCHAT_VIA_LABCELL =
  'Beuchat L.R. 1981, Cereal Foods World 26:345, as given in the Labcell Ltd chart "Water activity and growth of microorganisms in food" (adapted from Beuchat 1981; the original was not read)'
export const GUELPH_MOISTURE =
  'University of Guelph, Food Science, "Moisture content" (n.d., page read): yeasts and moulds need about aw 0.70 at least'

// Apricots, figs
export const PAVKOV_2021 =
  'Pavkov I., Radojčin M., Stamenković Z., Kešelj K., Tylewicz U., Sipos P., Ponjičan O., Sedlar A. 2021, Effects of osmotic dehydration on the hot air drying of apricot halves, Processes 9(2):202, doi:10.3390/pr9020202 (abstract)'
export const CODEX_APRICOTS_VIA_SUMMARY =
  'Codex Alimentarius, CODEX STAN 130-1981 Standard for dried apricots, as given in the summary on a document-sharing copy of the standard ("moisture content no more than 20–25 %"; the standard text was not read)'
export const REJABOV_2024 =
  'Rejabov S., Usmonov B., Usmanov K., Artikov A. 2024, Experimental comparison of open sun and indirect convection solar drying methods for apricots in Uzbekistan, Eng. Proc. 67(1):26 (abstract as given on the INC study page)'
export const OKSAR_2017 =
  'Oksar R.E., Şen F., Aksoy U. 2017, Effect of drying under plastic tunnels on drying rate and quality of fig (Ficus carica L. "Sarılop"), Acta Hortic. 1173:297–302 (abstract)'

// Vegetables
export const DOYMAZ_2007 =
  'Doymaz I. 2007, Air-drying characteristics of tomatoes, J. Food Eng. 78:1291–1297 (abstract)'
export const HOSSAIN_BALA_2007 =
  'Hossain M.A., Bala B.K. 2007, Drying of hot chilli using solar tunnel drier, Solar Energy 81:85–92 (abstract)'
export const MEGHWAR_PJAR =
  'Meghwar B.L., Khan A., Lakhiar I.A., Mirani A.A., Daper M.S., Kalroo M.W. n.d. (trials of November 2022), Comparison between solar tunnel, solar-cum gas dryer, and open sun drying methods for drying red chilies, Pak. J. Agric. Res. 36(1):63–70 (abstract; the year is not shown on the page read)'
export const BHONG_KALE_2020 =
  'Bhong M.G., Kale V.M. 2020, Drying mechanism of Indian dark red onion slices at high velocity, AIMS Agric. Food 5(2):245–261, doi:10.3934/agrfood.2020.2.245 (abstract)'
export const COSTA_FUJI_APPLE =
  'Costa B.R., da Silva R.S.G., Machado Júnior F.R.A., Coelho K., Pinto L.A.A. n.d., Characterization of the Fuji apple drying in thin layer (introduction of the copy read; the year is not shown on it)'

export const NEWMAN_1996 =
  'Newman G.M., Price W.E., Woolf L.A. 1996, Factors influencing the drying of prunes. 1. Effects of temperature upon the kinetics of moisture loss during drying, Food Chem. 57(2):241–244 (abstract)'
export const SIMAL_2005 =
  'Simal S., Garau C., Femenia A., Rosselló C. 2005, Drying of red pepper (Capsicum annuum): water desorption and quality, Int. J. Food Eng. 1(4), article 1, doi:10.2202/1556-3758.1022 (abstract)'

// Herbs, fish, coffee, cocoa, hops
export const DOYMAZ_2006 =
  'Doymaz I. 2006, Thin-layer drying behaviour of mint leaves, J. Food Eng. 74:370–375 (abstract)'
export const JAIN_PATHARE_2007 =
  'Jain D., Pathare P.B. 2007, Study the drying kinetics of open sun drying of fish, J. Food Eng. 78:1315–1319 (abstract and introduction)'
export const WEXLER_HASEGAWA_1954 =
  'Wexler A., Hasegawa S. 1954, Relative humidity–temperature relationships of some saturated salt solutions in the temperature range 0 to 50 °C, J. Res. Natl. Bur. Stand. 53(1), RP2512 (abstract)'
export const ICO_2004 =
  'International Coffee Organization 2004, Resolution 420 (Coffee Quality-Improvement Programme, modifying Resolution 407 of 2002), as stated on the ICO page "Improving quality": exportable coffee neither below 8 % nor above 12.5 % moisture (ISO 6673)'
export const SANDOVAL_2020 =
  'Sandoval A., Barreiro J., De Sousa A., Blanco D., Gimenez C. 2020, Sorption characteristics of peeled beans and shells of fermented and dry Trinitario cocoa beans (Theobroma cacao L.), Rev. Téc. Ing. Univ. Zulia 43(1) (abstract)'
export const NDUKWU_2010 =
  'Ndukwu M.C., Ogunlowo A.S., Olukunle O.J. 2010, Cocoa bean (Theobroma cacao L.) drying kinetics, Chilean J. Agric. Res. 70(4):633–639 (abstract)'
export const ADEYEMI_2020 =
  'Adeyemi S.A., Obayopo S.O., Akharume F. 2020, Evaluation of intermittent solar drying with seasonal variation on the quality of dried cocoa beans, J. Food Sci. Technol. (SiftDesk) 5(1):27–39 (abstract)'
export const BROWN_2013 =
  'Brown D. 2013 (Sept. 16), Drying hops on a small scale, Michigan State University Extension (page read)'

export const RYBKA_2021 =
  'Rybka A., Heřmánek P., Honzík I. 2021, Effect of drying temperature in hop dryer on hop quality, Res. Agr. Eng. 67:1–7 (abstract)'

// Grain
export const GELY_GINER_2007 =
  'Gely M.C., Giner S.A. 2007, Diffusion coefficient relationships during drying of soya bean cultivars, Biosyst. Eng. 96(2):213–222 (abstract; the decimal points of its numbers were lost in the copy read)'
export const IRRI_DRYING =
  'IRRI Rice Knowledge Bank n.d., "Drying" (step-by-step production, postharvest; page read)'
export const WIKIPEDIA_EMC =
  'as given in Wikipedia, "Equilibrium moisture content" (grain table and safe storage moisture; the sources it cites were not opened)'
export const MUNOZ_REBUFEL_RICE =
  'Muñoz C. R., Rebufel A. P. n.d., Equilibrium moisture to rough rice, variety Oro, to 10°, 25° and 40 °C temperatures, INIA La Platina, Chilean J. Agric. Res. archive (abstract; the year is not shown on the page read)'
export const ALVES_COFFEE =
  'Alves G.E., Isquierdo E.P., Borém F.M., Siqueira V.C., Oliveira P.D., Andrade E.T. n.d., Drying kinetics of natural coffee for different temperatures and low relative humidity, Coffee Science (UFLA), article 422 (abstract; the year is not shown on the page read)'
export const LOTUS_EMC_25C =
  'Lotus Harvestec n.d., Storage technicalities (company web page lotusharvestec.com/storage-technicalities, read): table "Equilibrium Moisture Content (%wb) at 25°C" (its own source not named)'
export const PAMI_EMC_CHARTS =
  'PAMI n.d., Moisture content charts for grain storage management (emc.pamifiles.ca; introduction read): modified Oswin "for lentils, durum and oats", after ASABE D245.5'
export const UKY_EMC_2012 =
  'Lee C. 2012 (Sept. 25), Moisture content charts, University of Kentucky Grain Crops blog, quoting the EMC chart by S. McNeill (page read)'

// Transcriptions in public code (read in the stored copy of the repository named; the originals were not read)
export const SIMULADOR_SECAGEM =
  'the public code jaugustodantas/projetoSimuladorDeSecagem (GitHub), calculoSecagem.py: a Thompson-model corn drying simulator whose calculoVariavelA/B give A = -1.706 + 0.0088·T and B = 148.7·exp(-0.059·T) with T the equilibrium temperature in °C and t in h; its companion calculoSecagemM.py says it follows the equations of "the book by Juarez" (J. S. Silva\'s Brazilian drying and storage textbook, eqs. 24-39; the book was not read)'

// Wheat
export const GONELI_WHEAT =
  'Goneli A.L.D., Corrêa P.C., Resende O., Reis Neto S.A. n.d., Estudo da difusão de umidade em grãos de trigo durante a secagem (Study of moisture diffusion in wheat grain drying), Ciênc. Tecnol. Aliment. (SciELO Brazil; abstract read, authors on a document-sharing copy of the first page; the year is not shown on the copies read)'

// Apple, fish
export const MORAES_2008_APPLE =
  'Moraes M.A., Rosa G.S., Pinto L.A.A. n.d., Moisture sorption isotherms and thermodynamic properties of apple Fuji and garlic (abstract in the FURG institutional repository, handle 1/6695; the year is not shown on the page read)'
export const SABLANI_2001 =
  'Sablani S.S., Myhara R.M., Al-Attabi Z.H., Al-Mugheiry M.M. 2001, Water sorption isotherms of freeze dried fish sardines, Drying Technol. 19(3-4):673–680 (abstract on the Sultan Qaboos University research portal)'
export const ALAM_ISLAM_2015 =
  'Alam Md.M., Islam Md.N. 2015, Study on water sorption isotherm of summer onion, Bangladesh J. Agril. Res. 40(1):35–51 (abstract, on a document-sharing copy of the first page)'

package catalog

// The tables the marking decoder reads: makers' prefixes, logos as they are
// misread as letters, transistor prefixes, and package and grade suffixes.
// Each row names where it comes from; "from memory" marks a row that could
// not be confirmed against the maker's ordering-information table.

// makerPrefixes are letters makers print before the generic number of a
// regulator ("LM" in LM317T, "MC" in MC7805CT). A known prefix costs nothing;
// unknown letters before the number cost a little (see unknownPrefixCost).
var makerPrefixes = map[string]string{
	"LM":   "National Semiconductor / TI, also ST, onsemi, Fairchild second sources (LM317T, LM7805CT: TI LM340/LM78xx SNOSBT0, ST LM317 DS0433)",
	"MC":   "Motorola / onsemi (MC7805CT: onsemi MC7800/D)",
	"UA":   "Fairchild / TI µA78xx, µ read as U (TI µA7800 SLVS056)",
	"L":    "SGS-Thomson / ST (L7805CV: ST L78 DS0422)",
	"LD":   "ST low-drop (LD1117V33: ST LD1117 DS0464)",
	"LF":   "ST low-drop fixed (LF33C: ST LFxx Doc ID 2574 Rev 25)",
	"KA":   "Samsung / Fairchild (KA7805: Fairchild KA78XX Rev 1.1.1)",
	"KIA":  "KEC (KIA7805AP), from memory",
	"AN":   "Panasonic / Matsushita (AN7805), from memory",
	"NJM":  "JRC / Nisshinbo (NJM7805FA), from memory",
	"TA":   "Toshiba (TA7805S), from memory",
	"UPC":  "NEC µPC78xx, µ read as U (µPC7805H), from memory",
	"HA":   "Hitachi (HA178L05), from memory",
	"LT":   "Linear Technology (LT1084CT, LT1086CM: LT1083/84/85 and LT1086 datasheets)",
	"LTC":  "Linear Technology, from memory",
	"AMS":  "Advanced Monolithic Systems (AMS1117-3.3), from memory",
	"AZ":   "BCD / Diodes (AZ1117-3.3), from memory",
	"AP":   "Diodes Inc. (AP1117E33), from memory",
	"SPX":  "Sipex / Exar (SPX1117M3-3.3), from memory",
	"NCP":  "onsemi (NCP1117ST33T3G), from memory",
	"NCV":  "onsemi automotive grade (NCV7805BTG: onsemi MC7800/D)",
	"MIC":  "Micrel (MIC2940A-5.0BT), from memory",
	"LP":   "National / onsemi (LP2950CZ-5.0: onsemi LP2950/D)",
	"REG":  "Burr-Brown / TI (REG1117-3.3: TI SBVS001D)",
	"TS":   "Taiwan Semiconductor (TS7805CZ, TS1117), from memory",
	"CJ":   "Changjiang (CJ78L05), from memory",
	"HT":   "Holtek (HT7333), from memory",
	"XC":   "Torex (XC6206P332MR), from memory",
	"ME":   "Microne (ME6206A33), from memory",
	"SG":   "Silicon General (SG7805), from memory",
	"RC":   "Raytheon (RC7805), from memory",
	"TL":   "TI (TL783CKC: TI SLVS036), TL431 is a shunt reference",
	"IRU":  "International Rectifier regulators (IRU1117), from memory",
	"BA":   "Rohm (BA178M05), from memory",
	"UTC":  "Unisonic (UTC 7805 read as one word), from memory",
	"WS":   "Winsemi (WS78L05), from memory",
	"GL":   "Goldstar / LG (GL7805), from memory",
	"SI":   "Sanken (SI-3052V), from memory",
	"MCP":  "Microchip (MCP1700T-3302E/TT), from memory",
	"TPS":  "TI (TPS7A4701), from memory",
	"AS":   "Alpha / Astec (AS1117), from memory",
	"LDS":  "LD read with a trailing S, ST, from memory",
	"LMS":  "National (LMS8117), from memory",
	"ADP":  "Analog Devices (ADP3338), from memory",
	"M5F":  "Mitsubishi (M5F7805L), from memory",
	"UC":   "Unitrode, from memory",
	"ICL":  "Intersil, from memory",
	"MAX":  "Maxim (MAX603), from memory",
	"SC":   "Semtech, from memory",
	"TLE":  "Infineon / Siemens automotive (TLE4275), from memory",
	"TLV":  "TI (TLV1117-33), from memory",
	"STLQ": "ST (STLQ015), from memory",
	"LDL":  "ST (LDL1117S33R), from memory",
}

// logos are makers' logos as a reader turns them into letters in front of the
// part number (the ST logo read as "ST", Motorola's batwing as "M"). They cost
// nothing before a known prefix. Common practice, no source.
var logos = []string{"ST", "M", "N", "NS", "F", "TI", "ON", "JRC", "KEC", "SGS", "R", "Z"}

// unknownPrefixCost is the cost of each unknown letter before the number;
// a prefix of more than maxUnknownPrefix unknown letters is not a prefix.
const (
	unknownPrefixCost = 0.25
	maxUnknownPrefix  = 4
)

// transistorPrefixes are the letters that open a transistor's or MOSFET's
// type number (JEDEC 2N, JIS 2S, Pro Electron BC/BD/BF/BU, makers' house
// prefixes). A part number that opens with one of them, followed by a digit,
// is no regulator, whatever digits follow: BC337 is an NPN transistor, not
// a 337; IRF7805 a MOSFET, not a 7805. Each prefix lists the devices it
// names (JEDEC EIA-370 for 2N; JEITA ED-4001 for 2S; Pro Electron for the
// two-letter codes; makers' house prefixes from memory).
var transistorPrefixes = map[string][]Device{
	"2N":   {DeviceNPN, DevicePNP, DeviceNPNDarlington, DeviceNMOS},
	"2SA":  {DevicePNP},
	"2SB":  {DevicePNP},
	"2SC":  {DeviceNPN},
	"2SD":  {DeviceNPN, DeviceNPNDarlington},
	"2SK":  {DeviceNMOS},
	"2SJ":  {DevicePMOS},
	"BC":   {DeviceNPN, DevicePNP},
	"BCP":  {DeviceNPN, DevicePNP},
	"BCX":  {DeviceNPN, DevicePNP},
	"BD":   {DeviceNPN, DevicePNP, DeviceNPNDarlington},
	"BDX":  {DeviceNPNDarlington, DevicePNPDarlington},
	"BDW":  {DeviceNPNDarlington, DevicePNPDarlington},
	"BDV":  {DeviceNPNDarlington, DevicePNPDarlington},
	"BF":   {DeviceNPN, DevicePNP},
	"BU":   {DeviceNPN},
	"BUT":  {DeviceNPN},
	"BUX":  {DeviceNPN},
	"BUZ":  {DeviceNMOS},
	"BUK":  {DeviceNMOS},
	"BSS":  {DeviceNMOS},
	"BSP":  {DeviceNMOS},
	"TIP":  {DeviceNPN, DevicePNP, DeviceNPNDarlington, DevicePNPDarlington},
	"MJ":   {DeviceNPN, DevicePNP, DeviceNPNDarlington},
	"MJE":  {DeviceNPN, DevicePNP, DeviceNPNDarlington},
	"MJD":  {DeviceNPN, DevicePNP},
	"MJF":  {DeviceNPN, DevicePNP},
	"MJH":  {DeviceNPN, DevicePNP, DeviceNPNDarlington},
	"MPS":  {DeviceNPN, DevicePNP},
	"MPSA": {DeviceNPN, DevicePNP, DeviceNPNDarlington},
	"PN":   {DeviceNPN, DevicePNP},
	"ZTX":  {DeviceNPN, DevicePNP},
	"KSA":  {DevicePNP},
	"KSB":  {DevicePNP},
	"KSC":  {DeviceNPN},
	"KSD":  {DeviceNPN},
	"KSE":  {DeviceNPN, DevicePNP},
	"IRF":  {DeviceNMOS, DevicePMOS},
	"IRFB": {DeviceNMOS},
	"IRFP": {DeviceNMOS},
	"IRFZ": {DeviceNMOS},
	"IRFR": {DeviceNMOS},
	"IRFU": {DeviceNMOS},
	"IRFI": {DeviceNMOS},
	"IRFS": {DeviceNMOS},
	"IRL":  {DeviceNMOS},
	"IRLZ": {DeviceNMOS},
	"STP":  {DeviceNMOS},
	"FQP":  {DeviceNMOS},
	"FQPF": {DeviceNMOS},
	"IXTP": {DeviceNMOS},
	"PHP":  {DeviceNMOS},
	"MMBT": {DeviceNPN, DevicePNP},
	"PMBT": {DeviceNPN, DevicePNP},
	"BCW":  {DeviceNPN, DevicePNP},
	"BCV":  {DeviceNPN, DevicePNP, DeviceNPNDarlington},
}

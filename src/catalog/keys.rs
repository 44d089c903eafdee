//! Every key of the catalog file, defined once: its name, what it means,
//! the kind of value it takes (with the units accepted), its default and
//! its plausible range. The reader ([`super::validate`]) takes the ranges
//! and names of the keys it checks from here, the schema for editors
//! ([`crate::schema::catalog`]) is generated from here, and a test proves
//! that the reader's own structures ([`super::raw`]) have exactly these
//! keys, table by table.

use crate::units::{AreaK, AreaLoadK, InertiaK, Kind, LengthK, LineLoadK, PriceK, StressK, UnitWeightK};

/// A plausible range, in `unit`: values outside are typing mistakes far
/// more often than real members (common practice, no source).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Range {
    /// Least value.
    pub lo: f64,
    /// Greatest value.
    pub hi: f64,
    /// The unit of `lo` and `hi` ("" for a plain number).
    pub unit: &'static str,
}

/// The kind of value a key takes.
#[derive(Debug, Clone, Copy)]
pub enum Value {
    /// A quantity written with its unit ("5000 psi").
    Quantity {
        /// What it is ("a stress").
        kind: &'static str,
        /// The spellings accepted, and their factors to the internal unit.
        units: &'static [(&'static str, f64)],
        /// More spellings, of a second kind the key also takes.
        also: &'static [(&'static str, f64)],
        /// The plausible range, if the reader checks one.
        range: Option<Range>,
        /// Whether it must be greater than zero.
        positive: bool,
    },
    /// A whole number in a range.
    Count(i64, i64),
    /// A plain number in a range.
    Number(Range),
    /// One of a fixed set of words.
    Choice(&'static [&'static str]),
    /// One of a fixed set of words, or a quantity.
    ChoiceOrQuantity {
        /// The words.
        choices: &'static [&'static str],
        /// The quantity's kind.
        kind: &'static str,
        /// Its spellings.
        units: &'static [(&'static str, f64)],
        /// Its range.
        range: Range,
    },
    /// Free text.
    Text,
    /// A list of free-text lines.
    TextList,
    /// A list of lengths ("4 in", "12 in").
    LengthList,
    /// A point, two lengths [x, y].
    Point,
    /// A list of at least `n` points.
    Points(usize),
    /// A table.
    Table(&'static Table),
    /// A list of tables (`[[…]]`).
    Tables(&'static Table),
}

/// One key.
#[derive(Debug, Clone, Copy)]
pub struct Key {
    /// The key as written.
    pub name: &'static str,
    /// What it means.
    pub help: &'static str,
    /// What it takes.
    pub value: Value,
    /// Its default when left out, as a user would write it ("" when none).
    pub default: &'static str,
    /// Whether it must be given.
    pub required: bool,
}

/// One table of the file and its keys.
#[derive(Debug)]
pub struct Table {
    /// Where it sits ("section.pattern.row").
    pub path: &'static str,
    /// What it is.
    pub help: &'static str,
    /// Its keys, in the order the reference gives them.
    pub keys: &'static [Key],
    /// Keys of which exactly one must be given (none: no such rule).
    pub exactly_one: &'static [&'static str],
}

impl Key {
    /// The range of a quantity, number or count key, if any.
    pub fn range(&self) -> Option<Range> {
        match self.value {
            Value::Quantity { range, .. } => range,
            Value::Number(r) | Value::ChoiceOrQuantity { range: r, .. } => Some(r),
            _ => None,
        }
    }
    /// The range of a count key.
    pub fn counts(&self) -> (i64, i64) {
        match self.value {
            Value::Count(lo, hi) => (lo, hi),
            _ => (i64::MIN, i64::MAX),
        }
    }
}

const fn q<K: Kind>(lo: f64, hi: f64, unit: &'static str) -> Value {
    Value::Quantity {
        kind: K::NAME,
        units: K::UNITS,
        also: &[],
        range: Some(Range { lo, hi, unit }),
        positive: false,
    }
}

const fn pos<K: Kind>() -> Value {
    Value::Quantity {
        kind: K::NAME,
        units: K::UNITS,
        also: &[],
        range: None,
        positive: true,
    }
}

const fn any<K: Kind>() -> Value {
    Value::Quantity {
        kind: K::NAME,
        units: K::UNITS,
        also: &[],
        range: None,
        positive: false,
    }
}

const fn key(name: &'static str, help: &'static str, value: Value) -> Key {
    Key {
        name,
        help,
        value,
        default: "",
        required: true,
    }
}

const fn opt(name: &'static str, help: &'static str, value: Value, default: &'static str) -> Key {
    Key {
        name,
        help,
        value,
        default,
        required: false,
    }
}

/// An entry's id.
const ID: Key = key("id", "a short id, unique in its list, that other entries name", Value::Text);
/// A name shown to users.
const DESIGNATION: Key = opt("designation", "the name shown to users", Value::Text, "the id");
/// Remarks.
const REMARKS: Key = opt("remarks", "free remarks shown with the entry", Value::Text, "");

// ---- [[mix]] ----

/// f′c.
pub const FC: Key = key("fc", "specified compressive strength f'c", q::<StressK>(2500.0, 15000.0, "psi"));
/// f′ci.
pub const FCI: Key = key(
    "fci",
    "compressive strength at transfer of prestress f'ci (at most f'c)",
    q::<StressK>(2000.0, 15000.0, "psi"),
);
/// Unit weight (the range of ACI 318-19 §19.2.2.1(a)).
pub const UNIT_WEIGHT: Key = key(
    "unit_weight",
    "unit weight of the concrete (the range of ACI 318-19 §19.2.2.1(a))",
    q::<UnitWeightK>(90.0, 160.0, "pcf"),
);
/// The words a mix's modulus may take.
pub const MODULUS_FORMULAS: &[&str] = &["unit-weight", "normalweight"];
/// Ec: a formula of ACI 318-19 §19.2.2.1 or a given value.
pub const EC: Key = opt(
    "modulus",
    "Ec: 'unit-weight' (33 wc^1.5 √f'c), 'normalweight' (57000 √f'c, normalweight aggregate only) or a value such as \"4400 ksi\" (ACI 318-19 §19.2.2.1)",
    Value::ChoiceOrQuantity {
        choices: MODULUS_FORMULAS,
        kind: StressK::NAME,
        units: StressK::UNITS,
        range: Range {
            lo: 1000.0,
            hi: 10000.0,
            unit: "ksi",
        },
    },
    "unit-weight",
);
/// `[[mix]]`.
pub static MIX: Table = Table {
    path: "mix",
    help: "a concrete mix that sections name",
    keys: &[
        ID,
        FC,
        FCI,
        UNIT_WEIGHT,
        key(
            "aggregate",
            "aggregate kind (sets the fire tables' rows and λ)",
            Value::Choice(crate::material::Aggregate::NAMES),
        ),
        EC,
    ],
    exactly_one: &[],
};

// ---- [[strand]] ----

/// Strand diameter.
pub const STRAND_DIAMETER: Key = key("diameter", "nominal diameter", q::<LengthK>(0.2, 0.75, "in"));
/// Strand area.
pub const STRAND_AREA: Key = key("area", "nominal area of one strand", q::<AreaK>(0.02, 0.35, "in2"));
/// fpu.
pub const FPU: Key = key("fpu", "specified tensile strength fpu", q::<StressK>(200.0, 300.0, "ksi"));
/// Eps.
pub const EPS: Key = opt(
    "modulus",
    "modulus of the strand Eps",
    q::<StressK>(25000.0, 30000.0, "ksi"),
    "28500 ksi",
);
/// The relaxation classes.
pub const RELAXATIONS: &[&str] = &["low", "stress-relieved"];
/// `[[strand]]`.
pub static STRAND: Table = Table {
    path: "strand",
    help: "a strand kind beyond the built-in sizes (3/8 in, 7/16 in, 1/2 in, 0.6 in, 9.5 mm, 11.1 mm, 12.7 mm, 15.2 mm)",
    keys: &[
        ID,
        STRAND_DIAMETER,
        STRAND_AREA,
        FPU,
        opt(
            "fpy",
            "yield strength fpy, between 0.80 fpu and fpu",
            any::<StressK>(),
            "0.90 fpu (low relaxation) or 0.85 fpu (stress-relieved), ASTM A416",
        ),
        EPS,
        opt("relaxation", "relaxation class", Value::Choice(RELAXATIONS), "low"),
    ],
    exactly_one: &[],
};

// ---- [[section]] and its geometry ----

/// Member depth.
pub const DEPTH: Key = key("depth", "total depth of the precast member", q::<LengthK>(2.0, 60.0, "in"));
/// Hollow-core width.
pub const WIDTH: Key = key("width", "nominal width of one unit", q::<LengthK>(12.0, 240.0, "in"));
/// Flange width of a tee.
pub const FLANGE_WIDTH: Key = key("flange_width", "flange width", q::<LengthK>(12.0, 240.0, "in"));
/// Number of cores.
pub const CORE_COUNT: Key = key("count", "number of cores", Value::Count(1, 30));
/// Number of stems.
pub const STEMS: Key = opt("stems", "number of stems", Value::Count(1, 6), "2");
/// Production length.
pub const MAX_LENGTH: Key = opt(
    "max_length",
    "longest member the plant makes",
    q::<LengthK>(5.0, 200.0, "ft"),
    "no limit",
);
/// Price.
const PRICE: Key = opt(
    "price",
    "price per plan area, in the catalog's own currency (\"8.50 /ft2\"), for the cost objective",
    any::<PriceK>(),
    "",
);

/// The core shapes.
pub const CORE_SHAPES: &[&str] = &["circle", "stadium", "oval", "rounded-rectangle"];
static CORES: Table = Table {
    path: "section.hollow_core.cores",
    help: "the cores, alike and evenly spaced",
    keys: &[
        key("shape", "core shape ('oval' is a stadium)", Value::Choice(CORE_SHAPES)),
        CORE_COUNT,
        opt("diameter", "diameter, for circular cores", pos::<LengthK>(), ""),
        opt("width", "width, for stadiums and rounded rectangles", pos::<LengthK>(), ""),
        opt("height", "height, for stadiums and rounded rectangles", pos::<LengthK>(), ""),
        opt(
            "corner_radius",
            "corner radius of rounded rectangles (at most half the smaller side)",
            pos::<LengthK>(),
            "",
        ),
        key("spacing", "centre-to-centre spacing", pos::<LengthK>()),
        opt(
            "center_height",
            "height of the core centres above the soffit",
            pos::<LengthK>(),
            "mid-depth",
        ),
    ],
    exactly_one: &[],
};
static KEYWAY: Table = Table {
    path: "section.hollow_core.keyway",
    help: "the grout keyway at each edge: a side-face profile, or the area removed",
    keys: &[
        opt(
            "profile",
            "side-face points [inset, height] from soffit to top",
            Value::Points(2),
            "",
        ),
        opt("area", "area removed at both edges together", pos::<AreaK>(), ""),
        opt(
            "center_height",
            "centroid height of that area above the soffit",
            pos::<LengthK>(),
            "mid-depth",
        ),
    ],
    exactly_one: &[],
};
static HOLLOW_CORE: Table = Table {
    path: "section.hollow_core",
    help: "hollow-core geometry",
    keys: &[
        WIDTH,
        DEPTH,
        key("cores", "the cores", Value::Table(&CORES)),
        opt("keyway", "the edge keyway", Value::Table(&KEYWAY), "none"),
    ],
    exactly_one: &[],
};
static DOUBLE_TEE: Table = Table {
    path: "section.double_tee",
    help: "double-tee geometry",
    keys: &[
        FLANGE_WIDTH,
        key("flange_thickness", "flange thickness", pos::<LengthK>()),
        DEPTH,
        STEMS,
        key("stem_spacing", "stem spacing, centre to centre", pos::<LengthK>()),
        key("stem_width_top", "stem width under the flange", pos::<LengthK>()),
        key("stem_width_bottom", "stem width at the soffit", pos::<LengthK>()),
        opt("chamfer", "45° chamfer at the stems' bottom corners", any::<LengthK>(), "0 in"),
    ],
    exactly_one: &[],
};
static VOID: Table = Table {
    path: "section.generic.void",
    help: "a void: a polygon (points) or a circle (center and diameter)",
    keys: &[
        opt("points", "polygon points [x, y]", Value::Points(3), ""),
        opt("center", "circle centre [x, y]", Value::Point, ""),
        opt("diameter", "circle diameter", pos::<LengthK>(), ""),
    ],
    exactly_one: &[],
};
static GENERIC: Table = Table {
    path: "section.generic",
    help: "any other section: an outline and voids",
    keys: &[
        key(
            "outline",
            "outline points [x, y], x across from the left edge, y up from the soffit",
            Value::Points(3),
        ),
        opt("void", "voids", Value::Tables(&VOID), "none"),
    ],
    exactly_one: &[],
};
static PUBLISHED: Table = Table {
    path: "section.published",
    help: "the producer's published figures, compared with ours (a warning beyond 2 %)",
    keys: &[
        opt("area", "area", any::<AreaK>(), ""),
        opt("yb", "centroid height above the soffit", any::<LengthK>(), ""),
        opt("inertia", "second moment of area", any::<InertiaK>(), ""),
        opt(
            "weight",
            "weight per plan area (psf) or per length (plf)",
            Value::Quantity {
                kind: "an area load or a line load",
                units: AreaLoadK::UNITS,
                also: LineLoadK::UNITS,
                range: None,
                positive: true,
            },
            "",
        ),
    ],
    exactly_one: &[],
};

// ---- [[section.pattern]] ----

/// Jacking stress ÷ fpu.
pub const JACKING: Key = opt(
    "jacking",
    "jacking stress as a fraction of fpu",
    Value::Number(Range {
        lo: 0.5,
        hi: 0.85,
        unit: "",
    }),
    "0.75",
);
/// Hold-down position ÷ member length.
pub const HOLD_DOWN: Key = opt(
    "hold_down",
    "hold-down points of depressed strand, as a fraction of the member length from each end (0.5: one point at midspan)",
    Value::Number(Range {
        lo: 0.05,
        hi: 0.5,
        unit: "",
    }),
    "",
);
/// Strands in a row (and in a pattern).
pub const STRANDS: Key = key("count", "number of strands in the row", Value::Count(1, 100));
/// Bars in a group.
pub const BARS: Key = key("count", "number of bars", Value::Count(1, 40));
/// Bar area.
pub const BAR_AREA: Key = key("area", "area of one bar", q::<AreaK>(0.05, 2.5, "in2"));
/// fy of bars and web steel.
pub const FY: Key = key("fy", "yield strength fy", q::<StressK>(40.0, 100.0, "ksi"));
/// Area of the shear legs in one stem per spacing.
pub const WEB_AREA: Key = key(
    "area",
    "area of the legs crossing a crack in one stem, at each spacing",
    q::<AreaK>(0.005, 2.0, "in2"),
);
/// Spacing of shear reinforcement.
pub const WEB_SPACING: Key = key("spacing", "spacing along the member", q::<LengthK>(1.0, 48.0, "in"));

static ROW: Table = Table {
    path: "section.pattern.row",
    help: "a row of strands",
    keys: &[
        STRANDS,
        key(
            "height",
            "height of the strand centres above the soffit (at the hold-downs if depressed)",
            pos::<LengthK>(),
        ),
        opt(
            "end_height",
            "height at the member ends, for depressed strand",
            pos::<LengthK>(),
            "the height (straight)",
        ),
        opt(
            "x",
            "positions across from the left edge, one per strand",
            Value::LengthList,
            "spread over the webs or stems",
        ),
        opt("debond", "debonded (shielded) length at each end", pos::<LengthK>(), "bonded"),
    ],
    exactly_one: &[],
};
static BAR: Table = Table {
    path: "section.pattern.bar",
    help: "mild reinforcement",
    keys: &[
        BARS,
        BAR_AREA,
        FY,
        key("height", "height of the bar centres above the soffit", pos::<LengthK>()),
    ],
    exactly_one: &[],
};
static WEB_STEEL: Table = Table {
    path: "section.pattern.web_steel",
    help: "shear reinforcement of one stem of a double tee",
    keys: &[WEB_AREA, WEB_SPACING, FY],
    exactly_one: &[],
};
/// `[[section.pattern]]`.
pub static PATTERN: Table = Table {
    path: "section.pattern",
    help: "a strand pattern of the section",
    keys: &[
        ID,
        DESIGNATION,
        key(
            "strand",
            "strand kind: a built-in size (3/8 in, 7/16 in, 1/2 in, 0.6 in, 9.5 mm, 11.1 mm, 12.7 mm, 15.2 mm) or a [[strand]] id",
            Value::Text,
        ),
        JACKING,
        HOLD_DOWN,
        opt("row", "strand rows", Value::Tables(&ROW), ""),
        opt("bar", "mild reinforcement", Value::Tables(&BAR), "none"),
        opt("web_steel", "shear reinforcement in each stem", Value::Table(&WEB_STEEL), "none"),
        opt(
            "price",
            "price per plan area (overrides the section's)",
            any::<PriceK>(),
            "the section's",
        ),
        opt(
            "max_length",
            "longest member (overrides the section's)",
            MAX_LENGTH.value,
            "the section's",
        ),
        REMARKS,
    ],
    exactly_one: &[],
};

/// `[[section]]`.
pub static SECTION: Table = Table {
    path: "section",
    help: "a cross-section and its strand patterns; give exactly one of hollow_core, double_tee, generic",
    keys: &[
        ID,
        DESIGNATION,
        key("mix", "the id of its [[mix]]", Value::Text),
        opt("hollow_core", "hollow-core geometry", Value::Table(&HOLLOW_CORE), ""),
        opt("double_tee", "double-tee geometry", Value::Table(&DOUBLE_TEE), ""),
        opt("generic", "any other geometry", Value::Table(&GENERIC), ""),
        opt("published", "the producer's published figures", Value::Table(&PUBLISHED), "none"),
        PRICE,
        MAX_LENGTH,
        REMARKS,
        key("pattern", "its strand patterns", Value::Tables(&PATTERN)),
    ],
    exactly_one: &["hollow_core", "double_tee", "generic"],
};

/// `[catalog]`.
pub static META: Table = Table {
    path: "catalog",
    help: "what this catalog is",
    keys: &[
        key("name", "catalog name", Value::Text),
        opt("producer", "producer", Value::Text, ""),
        opt("code", "code basis", Value::Text, "ACI 318-19"),
        opt("notes", "free notes", Value::TextList, ""),
        opt(
            "units",
            "the units its users read (a run's --units, then the job's, come first)",
            Value::Choice(&["us", "si"]),
            "us",
        ),
    ],
    exactly_one: &[],
};

/// The whole file.
pub static FILE: Table = Table {
    path: "",
    help: "a catalog of precast prestressed floor and roof members for plankwise",
    keys: &[
        key("catalog", "what this catalog is", Value::Table(&META)),
        opt("mix", "concrete mixes", Value::Tables(&MIX), ""),
        opt("strand", "strand kinds beyond the built-in sizes", Value::Tables(&STRAND), ""),
        key("section", "sections", Value::Tables(&SECTION)),
    ],
    exactly_one: &[],
};

/// Every table of the file, the whole file first.
pub fn tables() -> Vec<&'static Table> {
    fn walk(t: &'static Table, out: &mut Vec<&'static Table>) {
        out.push(t);
        for k in t.keys {
            if let Value::Table(s) | Value::Tables(s) = k.value {
                walk(s, out);
            }
        }
    }
    let mut out = Vec::new();
    walk(&FILE, &mut out);
    out
}

/// The key names of a table, in order.
pub fn names(t: &Table) -> Vec<&'static str> {
    t.keys.iter().map(|k| k.name).collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::catalog::raw;

    /// The field names a serde structure reads, captured from the
    /// `deserialize_struct` call its derived code makes.
    fn fields<'de, T: serde::Deserialize<'de>>() -> Vec<&'static str> {
        struct Catch(Option<&'static [&'static str]>);
        #[derive(Debug)]
        struct Stop;
        impl std::fmt::Display for Stop {
            fn fmt(&self, f: &mut std::fmt::Formatter) -> std::fmt::Result {
                f.write_str("stop")
            }
        }
        impl std::error::Error for Stop {}
        impl serde::de::Error for Stop {
            fn custom<M: std::fmt::Display>(_: M) -> Stop {
                Stop
            }
        }
        impl<'de> serde::Deserializer<'de> for &mut Catch {
            type Error = Stop;
            fn deserialize_any<V: serde::de::Visitor<'de>>(self, _: V) -> Result<V::Value, Stop> {
                Err(Stop)
            }
            fn deserialize_struct<V: serde::de::Visitor<'de>>(
                self,
                _: &'static str,
                fields: &'static [&'static str],
                _: V,
            ) -> Result<V::Value, Stop> {
                self.0 = Some(fields);
                Err(Stop)
            }
            serde::forward_to_deserialize_any! {
                bool i8 i16 i32 i64 i128 u8 u16 u32 u64 u128 f32 f64 char str string
                bytes byte_buf option unit unit_struct newtype_struct seq tuple
                tuple_struct map enum identifier ignored_any
            }
        }
        let mut c = Catch(None);
        let _ = T::deserialize(&mut c);
        c.0.expect("a struct").to_vec()
    }

    /// The reader's structures take exactly the keys this table defines,
    /// table by table: the schema and the reader cannot drift apart.
    #[test]
    fn the_reader_reads_exactly_the_keys_defined_here() {
        let sorted = |mut v: Vec<&'static str>| {
            v.sort_unstable();
            v
        };
        let pairs: Vec<(&Table, Vec<&str>)> = vec![
            (&META, fields::<raw::RawMeta>()),
            (&MIX, fields::<raw::RawMix>()),
            (&STRAND, fields::<raw::RawStrand>()),
            // patterns are split off by hand before the rest is read
            (&SECTION, [fields::<raw::RawSection>(), vec!["pattern"]].concat()),
            (&HOLLOW_CORE, fields::<raw::RawHollowCore>()),
            (&CORES, fields::<raw::RawCores>()),
            (&KEYWAY, fields::<raw::RawKeyway>()),
            (&DOUBLE_TEE, fields::<raw::RawDoubleTee>()),
            (&GENERIC, fields::<raw::RawGeneric>()),
            (&VOID, fields::<raw::RawVoid>()),
            (&PUBLISHED, fields::<raw::RawPublished>()),
            (&PATTERN, fields::<raw::RawPattern>()),
            (&ROW, fields::<raw::RawRow>()),
            (&BAR, fields::<raw::RawBar>()),
            (&WEB_STEEL, fields::<raw::RawWebSteel>()),
        ];
        for (t, f) in &pairs {
            assert_eq!(sorted(names(t)), sorted(f.clone()), "table [{}]", t.path);
        }
        // every table but the file itself is paired (the file's keys are
        // matched by hand in the reader: catalog, mix, strand, section)
        assert_eq!(pairs.len() + 1, tables().len());
        assert_eq!(names(&FILE), ["catalog", "mix", "strand", "section"]);
    }

    fn refused(text: &str) -> String {
        match crate::catalog::Catalog::from_str(text, "demo-us.toml") {
            Err(e) => e.to_string(),
            Ok(_) => panic!("accepted"),
        }
    }

    /// The reader refuses a value just outside a key's range with the
    /// range this table gives, in the table's unit.
    #[test]
    fn the_reader_takes_its_ranges_from_here() {
        let demo = crate::catalog::DEMO_US;
        for (from, to, key) in [
            ("fc = \"6000 psi\"", "fc = \"16000 psi\"", &FC),
            ("strand = \"1/2 in\"", "strand = \"1/2 in\"\njacking = 0.9", &JACKING),
        ] {
            assert!(demo.contains(from), "{from}");
            let text = demo.replacen(from, to, 1);
            let err = refused(&text);
            let r = key.range().expect("a range");
            let want = format!("{} to {}", crate::section::family::fmt(r.lo), crate::section::family::fmt(r.hi));
            assert!(err.contains(&want) && err.contains(key.name), "{err}");
        }
        let text = demo.replacen("count = 7, diameter", "count = 31, diameter", 1);
        let err = refused(&text);
        assert!(
            err.contains(&format!("{} to {}", CORE_COUNT.counts().0, CORE_COUNT.counts().1)),
            "{err}"
        );
    }
}

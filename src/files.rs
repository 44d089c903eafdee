//! Reading and writing the user's files safely. Rules every route keeps:
//! - reads take regular files only, never block (a FIFO or a device is
//!   refused at once) and stop at a size cap while reading, whatever the
//!   file's metadata says;
//! - a write never lands on an input (compared by file identity: device and
//!   inode after symlinks, not by name), never on anything but a regular
//!   file (a folder, FIFO, socket or device is refused even with force),
//!   replaces atomically, and keeps what kind of file the target is: a
//!   symlink to a regular file stays a symlink (the file it points to is
//!   replaced) and an existing file keeps its permissions.

use std::fs::{self, File, OpenOptions};
use std::io::{self, Read, Write};
use std::path::{Path, PathBuf};

/// What kind of thing a path is, in words, when it is not a regular file.
fn kind_of(ft: fs::FileType) -> &'static str {
    #[cfg(unix)]
    {
        use std::os::unix::fs::FileTypeExt;
        if ft.is_fifo() {
            return "a FIFO (named pipe)";
        }
        if ft.is_socket() {
            return "a socket";
        }
        if ft.is_block_device() || ft.is_char_device() {
            return "a device";
        }
    }
    if ft.is_dir() {
        "a folder"
    } else if ft.is_symlink() {
        "a symbolic link"
    } else {
        "not a regular file"
    }
}

/// Open a file for reading without blocking on a FIFO or a device.
fn open_read(path: &Path) -> io::Result<File> {
    let mut o = OpenOptions::new();
    o.read(true);
    #[cfg(unix)]
    {
        use std::os::unix::fs::OpenOptionsExt;
        o.custom_flags(libc::O_NONBLOCK);
    }
    o.open(path)
}

/// Read a regular file of at most `cap` bytes. The error is a sentence for
/// the user.
pub fn read_bounded(path: &Path, cap: u64) -> Result<Vec<u8>, String> {
    // a FIFO or a device is refused before it is opened
    let meta = fs::metadata(path).map_err(|e| format!("cannot read the file: {e}"))?;
    if !meta.file_type().is_file() {
        return Err(format!(
            "is {}, not a regular file; give the path of a .toml file",
            kind_of(meta.file_type())
        ));
    }
    let f = open_read(path).map_err(|e| format!("cannot read the file: {e}"))?;
    // and checked again on what was opened, in case it changed in between
    let meta = f.metadata().map_err(|e| format!("cannot read the file: {e}"))?;
    if !meta.file_type().is_file() {
        return Err(format!("is {}, not a regular file", kind_of(meta.file_type())));
    }
    let mut bytes = Vec::with_capacity(meta.len().min(cap) as usize);
    f.take(cap + 1)
        .read_to_end(&mut bytes)
        .map_err(|e| format!("cannot read the file: {e}"))?;
    if bytes.len() as u64 > cap {
        return Err(format!(
            "is larger than {} MB; plankwise reads files of at most that size",
            cap / (1024 * 1024)
        ));
    }
    Ok(bytes)
}

/// A file's identity: device and inode, after symlinks (None when it does
/// not exist or the platform has none).
pub fn identity(path: &Path) -> Option<(u64, u64)> {
    #[cfg(unix)]
    {
        use std::os::unix::fs::MetadataExt;
        fs::metadata(path).ok().map(|m| (m.dev(), m.ino()))
    }
    #[cfg(not(unix))]
    {
        path.canonicalize().ok().map(|p| {
            let h = crate::catalog::content_hash(&p.to_string_lossy());
            (0, u64::from_str_radix(&h, 16).unwrap_or(0))
        })
    }
}

/// Why a write was refused.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Refusal {
    /// The target exists and `force` was not given: ask first.
    Exists,
    /// Anything else, in words.
    No(String),
}

impl std::fmt::Display for Refusal {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            Refusal::Exists => f.write_str("exists; pass --force to replace it"),
            Refusal::No(s) => f.write_str(s),
        }
    }
}

/// Where a write may go: the regular file it will replace or create, after
/// symlinks. Refused when the target is an input, is not a regular file (a
/// folder, FIFO, socket, device, or a symlink to one, or a dangling
/// symlink), or exists and `force` is not given.
pub fn writable(path: &Path, inputs: &[&Path], force: bool) -> Result<PathBuf, Refusal> {
    if path.as_os_str().is_empty() {
        return Err(Refusal::No("is empty; give a file name".into()));
    }
    let id = identity(path);
    if id.is_some() && inputs.iter().any(|i| identity(i) == id) {
        return Err(Refusal::No(
            "is an input file; plankwise never writes over the catalog or the job".into(),
        ));
    }
    match fs::symlink_metadata(path) {
        Err(e) if e.kind() == io::ErrorKind::NotFound => {
            let dir = path.parent().filter(|d| !d.as_os_str().is_empty()).unwrap_or(Path::new("."));
            if !dir.is_dir() {
                return Err(Refusal::No(format!(
                    "cannot be written: its folder '{}' does not exist",
                    dir.display()
                )));
            }
            Ok(path.to_path_buf())
        }
        Err(e) => Err(Refusal::No(format!("cannot be written: {e}"))),
        Ok(link) => {
            let meta =
                fs::metadata(path).map_err(|_| Refusal::No("is a symbolic link to nothing; plankwise writes only regular files".into()))?;
            if !meta.file_type().is_file() {
                let what = kind_of(meta.file_type());
                let via = if link.file_type().is_symlink() { "a symbolic link to " } else { "" };
                return Err(Refusal::No(format!(
                    "is {via}{what}; plankwise writes only regular files, even with --force"
                )));
            }
            if !force {
                return Err(Refusal::Exists);
            }
            // a symlink stays a symlink: the file it points to is replaced
            path.canonicalize().map_err(|e| Refusal::No(format!("cannot be written: {e}")))
        }
    }
}

/// Write `bytes` to the regular file `path` atomically: a temporary file
/// beside it, synced, then renamed over it; an existing file's permissions
/// are kept. Call [`writable`] first.
pub fn write_atomic(path: &Path, bytes: &[u8]) -> io::Result<()> {
    write_atomic_with(path, |w| w.write_all(bytes))
}

/// [`write_atomic`] of what `fill` writes, streamed to the temporary file
/// (a long output is never held in memory).
pub fn write_atomic_with(path: &Path, fill: impl FnOnce(&mut dyn Write) -> io::Result<()>) -> io::Result<()> {
    let dir = path.parent().filter(|d| !d.as_os_str().is_empty()).unwrap_or(Path::new("."));
    let name = path.file_name().map_or("out".into(), |n| n.to_string_lossy().into_owned());
    let tmp = dir.join(format!(".{name}.plankwise-{}.tmp", std::process::id()));
    let result = (|| {
        let f = OpenOptions::new().write(true).create_new(true).open(&tmp)?;
        let mut w = io::BufWriter::new(f);
        fill(&mut w)?;
        let f = w.into_inner().map_err(|e| e.into_error())?;
        if let Ok(m) = fs::metadata(path) {
            f.set_permissions(m.permissions())?;
        }
        f.sync_all()?;
        fs::rename(&tmp, path)
    })();
    if result.is_err() {
        let _ = fs::remove_file(&tmp);
    }
    result
}

/// [`writable`] then [`write_atomic`]: the one way plankwise writes a file.
pub fn write_safely(path: &Path, bytes: &[u8], inputs: &[&Path], force: bool) -> Result<PathBuf, Refusal> {
    let real = writable(path, inputs, force)?;
    write_atomic(&real, bytes).map_err(|e| Refusal::No(format!("cannot be written: {e}")))?;
    Ok(real)
}

#[cfg(all(test, unix))]
mod tests {
    use super::*;

    fn scratch(name: &str) -> PathBuf {
        let d = std::env::temp_dir().join(format!("plankwise-files-{name}-{}", std::process::id()));
        let _ = fs::remove_dir_all(&d);
        fs::create_dir_all(&d).unwrap();
        d
    }

    #[test]
    fn a_symlink_to_a_file_stays_a_symlink_and_permissions_stay() {
        use std::os::unix::fs::PermissionsExt;
        let d = scratch("link");
        let real = d.join("real.txt");
        fs::write(&real, "old").unwrap();
        fs::set_permissions(&real, fs::Permissions::from_mode(0o640)).unwrap();
        let link = d.join("link.txt");
        std::os::unix::fs::symlink(&real, &link).unwrap();
        write_safely(&link, b"new", &[], true).unwrap();
        assert!(fs::symlink_metadata(&link).unwrap().file_type().is_symlink());
        assert_eq!(fs::read_to_string(&real).unwrap(), "new");
        assert_eq!(fs::metadata(&real).unwrap().permissions().mode() & 0o777, 0o640);
        // without force an existing file is not replaced
        assert_eq!(write_safely(&link, b"x", &[], false), Err(Refusal::Exists));
        // an input is never the target, however it is named
        let e = write_safely(&link, b"x", &[&real], true).unwrap_err();
        assert!(e.to_string().contains("is an input file"), "{e}");
        fs::remove_dir_all(&d).unwrap();
    }

    #[test]
    fn reads_stop_at_the_cap_and_refuse_what_is_not_a_file() {
        let d = scratch("read");
        let f = d.join("big.toml");
        fs::write(&f, vec![b'a'; 2000]).unwrap();
        assert!(read_bounded(&f, 1000).unwrap_err().contains("larger than"));
        assert_eq!(read_bounded(&f, 4000).unwrap().len(), 2000);
        assert!(read_bounded(&d, 10).unwrap_err().contains("a folder"));
        fs::remove_dir_all(&d).unwrap();
    }
}

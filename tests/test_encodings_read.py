"""Text tables in the encodings older systems export (issue 17, item 1).

Every table is invented and written here in tmp_path; the expected text of each byte comes
from Python's own codecs (cp1252, latin-1, utf-16), never from our decoder.
"""
from __future__ import annotations

import json

import pytest

from timelines import Chart, read
from timelines.cli.commands import main
from timelines.errors import SourceError, UsageError
from timelines.sources import read_table
from timelines.sources.decoding import decoded_text

PLACES = ("Saint-Étienne-des-Prés", "Les Forges-sur-Aube", "Île-Bréhat", "Cœurville")
EXPORT = ("site;place;not_before;not_after\n"
          "W1;Les Forges-sur-Aube;-300;-150\n"
          "W2;Saint-Étienne-des-Prés;-25;25\n"
          "W3;Île-Bréhat;150;200\n"
          "W4;Cœurville – “the old quay”;-1200;-800\n")


def _written(tmp_path, text: str, encoding: str, name: str = "export.csv"):
    path = tmp_path / name
    path.write_bytes(text.encode(encoding))
    return path


def test_windows_1252_bytes_are_read_with_one_note_naming_the_encoding_and_line(tmp_path):
    path = _written(tmp_path, EXPORT, "cp1252")
    table = read_table(path)
    assert [row[1] for row in table.rows] == [
        "Les Forges-sur-Aube", "Saint-Étienne-des-Prés", "Île-Bréhat",
        "Cœurville – “the old quay”"]
    [note] = table.notes
    assert note.kind == "note" and note.row == 3    # line 3: the first byte above 0x7F
    assert str(note) == (
        "export.csv:3: note: the file is not UTF-8 text; read as Windows-1252 (cp1252), "
        "first on line 3: 'Saint-Étienne-des-Prés' (if that does not read right, name the "
        "encoding with --encoding; a file saved as 'CSV UTF-8' needs none)")


@pytest.mark.parametrize("character", "ÉéÎîœŒ–—“”‘’€…ßÿ")
def test_each_windows_1252_character_reads_as_pythons_codec_says(tmp_path, character):
    byte = character.encode("cp1252")            # Python's codec: the reference
    assert len(byte) == 1 and byte[0] > 0x7F
    path = tmp_path / "one.csv"
    path.write_bytes(b"place,when\nA" + byte + b"b,1650\n")
    assert read_table(path).rows == ((f"A{byte.decode('cp1252')}b", "1650"),)


def test_latin1_text_reads_the_same_as_its_own_codec(tmp_path):
    # Latin-1 and Windows-1252 agree on every byte outside 0x80-0x9F (C1 controls in
    # Latin-1; Python's codecs): a Latin-1 export of letters reads exactly.
    text = "place,when\nSaint-Étienne-des-Prés,1650\nÎle-Bréhat,1651\n"
    path = _written(tmp_path, text, "latin-1")
    assert read_table(path).rows == tuple(
        tuple(line.split(",")) for line in text.encode("latin-1").decode("latin-1")
        .splitlines()[1:])


def test_utf8_with_and_without_mark_and_utf16_need_no_note(tmp_path):
    for encoding in ("utf-8", "utf-8-sig", "utf-16"):
        path = _written(tmp_path, EXPORT, encoding, f"export-{encoding}.csv")
        table = read_table(path)
        assert table.header == ("site", "place", "not_before", "not_after"), encoding
        assert table.rows[1][1] == "Saint-Étienne-des-Prés"
        assert table.notes == ()


def test_a_named_encoding_is_used_and_needs_no_note(tmp_path):
    # Mac Roman writes é as 0x8E, which Windows-1252 reads as Ž: only naming it reads it.
    path = _written(tmp_path, "place,when\nBréhat,1650\n", "mac-roman")
    assert read_table(path).rows == (("BrŽhat", "1650"),)
    named = read_table(path, encoding="mac-roman")
    assert named.rows == (("Bréhat", "1650"),) and named.notes == ()


def test_naming_utf8_refuses_other_bytes_as_before(tmp_path):
    path = _written(tmp_path, EXPORT, "cp1252")
    with pytest.raises(SourceError) as caught:
        read_table(path, encoding="utf-8")
    assert str(caught.value) == "export.csv: line 3 is not utf-8 text (byte 0xc9)"


def test_bytes_no_encoding_reads_cleanly_are_still_refused_with_the_hint(tmp_path):
    # 0x81 is undefined in Windows-1252 (Python's cp1252 codec raises on it).
    with pytest.raises(UnicodeDecodeError):
        b"\x81".decode("cp1252")
    path = tmp_path / "odd.csv"
    path.write_bytes(b"place,when\nA\xe9,1650\nB\x81,1651\n")
    with pytest.raises(SourceError) as caught:
        read_table(path)
    assert str(caught.value) == ("odd.csv: line 2 is not UTF-8 text (byte 0xe9), nor "
                                 "Windows-1252 (line 3 is not Windows-1252 text (byte 0x81))")
    assert "--encoding" in caught.value.hint and "CSV UTF-8" in caught.value.hint


def test_binary_data_and_mixed_encodings_are_refused(tmp_path):
    binary = tmp_path / "binary.csv"
    binary.write_bytes(b"place,when\n\xd0\xcf\x11\xe0\x00\x00,1650\n")
    with pytest.raises(SourceError, match="NUL byte: it is not a text table"):
        read_table(binary)
    mixed = tmp_path / "mixed.csv"
    mixed.write_bytes("place,when\nÉcole,1650\n".encode("utf-8")
                      + "Bréhat,1651\n".encode("cp1252"))
    with pytest.raises(SourceError) as caught:
        read_table(mixed)
    assert "line 3 is not UTF-8 text (byte 0xe9), but line 2 is" in str(caught.value)


def test_decoded_text_follows_the_rule_in_order():
    assert decoded_text(b"a,b\n", "t.csv").encoding == "utf-8"
    assert decoded_text("a,é\n".encode("utf-8-sig"), "t.csv").text == "a,é\n"
    assert decoded_text("a,é\n".encode("utf-16"), "t.csv").encoding == "utf-16"
    fallback = decoded_text("a,é\n".encode("cp1252"), "t.csv")
    assert (fallback.text, fallback.encoding, len(fallback.notes)) == ("a,é\n", "cp1252", 1)
    # A byte-order mark names the encoding even against a named one.
    assert decoded_text("a,é\n".encode("utf-16"), "t.csv", "cp1252").text == "a,é\n"


def test_an_unknown_encoding_is_a_usage_error_with_a_suggestion(tmp_path, capsys):
    path = _written(tmp_path, EXPORT, "cp1252")
    with pytest.raises(UsageError) as caught:
        read_table(path, encoding="latin-9x")
    assert str(caught.value) == "unknown encoding 'latin-9x'"
    assert caught.value.hint.startswith("did you mean")
    with pytest.raises(UsageError, match="not a text encoding"):
        Chart(path, encoding="rot13")
    with pytest.raises(SystemExit) as leaving:
        main(["check", str(path), "--encoding", "utf-88"])
    assert leaving.value.code == 2
    err = capsys.readouterr().err
    assert "unknown encoding 'utf-88'" in err and "did you mean 'utf-8'" in err


def test_check_render_and_lanes_report_the_note_and_read_every_row(tmp_path, capsys):
    path = _written(tmp_path, EXPORT, "cp1252")
    columns = ["--start", "not_before", "--end", "not_after", "--label", "place"]
    for command in (["check"], ["render", "-o", str(tmp_path / "out.svg")], ["lanes"]):
        code = main([*command, str(path), *columns])
        out, err = capsys.readouterr()
        said = out + err       # check reports on stdout; render and lanes on stderr
        assert code == 0, said
        assert said.count("read as Windows-1252 (cp1252)") == 1
        assert "4 rows read: 4 drawn" in said
    assert "Cœurville" in (tmp_path / "out.svg").read_text(encoding="utf-8")


def test_the_encoding_option_forces_one_and_is_a_config_key(tmp_path, capsys):
    path = _written(tmp_path, "place,when\nBréhat,1650\n", "mac-roman")
    assert main(["check", str(path), "--encoding", "mac-roman", "--json"]) == 0
    report = json.loads(capsys.readouterr().out)
    assert "Windows-1252" not in json.dumps(report)
    config = tmp_path / "timelines.toml"
    config.write_text('encoding = "utf-8"\n', encoding="utf-8")
    cp1252 = _written(tmp_path, EXPORT, "cp1252", "cp.csv")
    assert main(["check", str(cp1252), "--config", str(config)]) == 1
    assert "line 3 is not utf-8 text" in capsys.readouterr().err


def test_bands_and_read_take_the_encoding(tmp_path):
    bands = _written(tmp_path, "label,start,end\nÉpoque des forges,-300,-150\n", "cp1252",
                     "bands.csv")
    table = _written(tmp_path, EXPORT, "cp1252")
    chart = Chart(table).columns(start="not_before", end="not_after").bands(str(bands))
    laid = chart.layout()
    assert [band.label for band in laid.bands.records] == ["Époque des forges"]
    assert any("Windows-1252" in str(note) for note in laid.bands.problems)
    frame = read(table, start="not_before", end="not_after")
    assert frame["place"].tolist()[1] == "Saint-Étienne-des-Prés"
    assert read(table, start="not_before", end="not_after", encoding="latin-1")[
        "place"].tolist()[2] == "Île-Bréhat"

"""Settings from a TOML file and the command line, and where each one came from.

A config file holds the command-line options by their long names, without the dashes:

    # register.toml
    start = "admitted"
    end = "left"
    group = "craft"
    group-order = ["Weaver", "Dyer"]     # a list, or "first", "name", "size"
    lane-gap = "2y"
    max-lanes = 12

An option given on the command line wins over the file, the file over the default. Which
options exist, and how their values are read, is the argparse parser's business: a file's
value goes through the same `type` and `choices` as the option's text would (`apply_settings`).
"""
from __future__ import annotations

import argparse
import difflib
import json
import tomllib
from collections.abc import Callable, Collection, Iterable, Mapping
from dataclasses import dataclass
from pathlib import Path

from ..errors import UsageError
from ..layout.distances import Distance

DEFAULT, CONFIG_FILE, COMMAND_LINE = "default", "config file", "command line"


@dataclass(frozen=True, slots=True)
class Setting:
    name: str              # the option's long name, e.g. "lane-gap"
    value: object
    origin: str            # DEFAULT, CONFIG_FILE or COMMAND_LINE
    source: str = ""       # the config file, when it came from one


def read_config(path: str | Path) -> dict[str, object]:
    """The keys and values of a TOML config file; a usage error when it cannot be read."""
    path = Path(path)
    try:
        text = path.read_text(encoding="utf-8")
    except FileNotFoundError:
        raise UsageError(f"{path}: no such config file",
                         hint="check the path given to --config") from None
    except (OSError, UnicodeDecodeError) as error:
        raise UsageError(f"{path}: cannot read the config file ({error})") from error
    try:
        values = tomllib.loads(text)
    except tomllib.TOMLDecodeError as error:
        # tomllib says where: "Invalid value (at line 3, column 8)"
        raise UsageError(f"{path}: not a valid TOML file: {error}",
                         hint='each line is a key and a value, e.g. pack = "compact"') from error
    for key, value in values.items():
        if isinstance(value, dict):
            raise UsageError(f"{path}: [{key}] is a table; settings go at the top level",
                             hint="write the options as key = value lines, with no [sections]")
    return values


def check_keys(config: Mapping[str, object], known: Iterable[str], path: str | Path) -> None:
    """A usage error for the first key that is no option of any command."""
    known = sorted(set(known))
    for key in config:
        if key not in known:
            close = difflib.get_close_matches(key.replace("_", "-"), known, n=3, cutoff=0.6)
            hint = ("did you mean " + " or ".join(repr(name) for name in close) + "?"
                    if close else "the keys are the long option names, e.g. group, pack, "
                                  "lane-gap")
            raise UsageError(f"{path}: unknown setting {key!r}", hint=hint)


def merge(defaults: Mapping[str, object], config: Mapping[str, object],
          given: Mapping[str, object], config_path: str = "") -> dict[str, Setting]:
    """Each setting's effective value: the command line's, else the file's, else the default."""
    settings = {}
    for name, default in defaults.items():
        if name in given:
            settings[name] = Setting(name, given[name], COMMAND_LINE)
        elif name in config:
            settings[name] = Setting(name, config[name], CONFIG_FILE, config_path)
        else:
            settings[name] = Setting(name, default, DEFAULT)
    return settings


def config_lines(settings: Iterable[Setting], unset: Mapping[str, str] = {}) -> list[str]:
    """The settings as TOML lines, each with where it came from: a file `--config` reads.
    A setting with no value is a comment, saying what `unset` says that means."""
    settings = list(settings)
    assignments = [_assignment(s, unset) for s in settings]
    width = max(map(len, assignments), default=0)
    lines = []
    for setting, assignment in zip(settings, assignments):
        origin = setting.origin + (f" {setting.source}" if setting.source else "")
        lines.append(f"{assignment:<{width}}  # {origin}")
    return lines


def _assignment(setting: Setting, unset: Mapping[str, str]) -> str:
    if setting.value is None:
        return f"# {setting.name}: {unset.get(setting.name, 'not set')}"
    return f"{setting.name} = {toml_value(setting.value)}"


def toml_value(value: object) -> str:
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, (int, float)):
        return repr(value)
    if isinstance(value, Distance):
        value = value.text
    if isinstance(value, (list, tuple)):
        return "[" + ", ".join(toml_value(item) for item in value) + "]"
    # A JSON string is a TOML basic string for everything a setting holds.
    return json.dumps(str(value), ensure_ascii=False)


def apply_settings(make_parser: Callable[[], argparse.ArgumentParser], argv: list[str],
                   args: argparse.Namespace, commands: Collection[str],
                   not_settings: Collection[str]) -> dict[str, Setting]:
    """Fill `args` from the command line, then `args.config`, then the defaults.

    `make_parser` builds the program's parser (a fresh one tells which options `argv` wrote
    out); `commands` are the subcommands that read a config file, whose options' long names
    are the file's keys, except the destinations in `not_settings`. Returns the effective
    settings of `args.command` by name."""
    parsers = subcommand_parsers(make_parser())
    actions = setting_actions(parsers[args.command], not_settings)
    config: dict[str, object] = {}
    path = str(args.config or "")
    if path:
        config = read_config(path)
        check_keys(config, {name for command in commands
                            for name in setting_actions(parsers[command], not_settings)}, path)
    given = options_given(make_parser(), argv)
    settings = merge({name: action.default for name, action in actions.items()},
                     {name: config_value(actions[name], name, value, path)
                      for name, value in config.items() if name in actions},
                     {name: getattr(args, action.dest) for name, action in actions.items()
                      if action.dest in given}, path)
    for name, setting in settings.items():
        setattr(args, actions[name].dest, setting.value)
    return settings


def subcommand_parsers(parser: argparse.ArgumentParser) -> dict[str, argparse.ArgumentParser]:
    found = [a for a in parser._actions if isinstance(a, argparse._SubParsersAction)]
    return dict(found[0].choices) if found else {}


def setting_actions(parser: argparse.ArgumentParser, not_settings: Collection[str]
                    ) -> dict[str, argparse.Action]:
    """The options a config file may set, by long name without the dashes."""
    actions = {}
    for action in parser._actions:
        long_names = [o for o in action.option_strings if o.startswith("--")]
        if long_names and action.dest not in not_settings:
            actions[long_names[0][2:]] = action
    return actions


def options_given(parser: argparse.ArgumentParser, argv: list[str]) -> set[str]:
    """The destinations of the options `argv` writes out. With every default suppressed,
    argparse sets only those."""
    for each in [parser, *subcommand_parsers(parser).values()]:
        for action in each._actions:
            action.default = argparse.SUPPRESS
    return set(vars(parser.parse_args(argv)))


def config_value(action: argparse.Action, name: str, value: object, path: str) -> object:
    """A config file's value, read as the command line reads the option's text."""
    if action.nargs == 0:                     # a flag such as --strict
        if not isinstance(value, bool):
            raise UsageError(f"{path}: {name} must be true or false, not {value!r}")
        return value
    if isinstance(value, list) and (name.endswith("-order")
                                    or name in ("font", "longest-by-group")):
        value = ",".join(str(item) for item in value)
    if isinstance(value, (bool, list, dict)):
        raise UsageError(f"{path}: {name} cannot be {toml_value(value)}",
                         hint=f'write it as on the command line, e.g. {name} = "..."')
    text = str(value)
    try:
        converted = action.type(text) if action.type else text
    except (argparse.ArgumentTypeError, ValueError, TypeError) as error:
        raise UsageError(f"{path}: {name}: {error}") from None
    if action.choices is not None and converted not in action.choices:
        choices = [str(choice) for choice in action.choices]
        close = difflib.get_close_matches(text, choices, n=1)
        raise UsageError(f"{path}: {name} must be one of {', '.join(choices)}, not {value!r}",
                         hint=f"did you mean {close[0]!r}?" if close else None)
    return converted
